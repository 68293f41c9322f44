export type MailListFilters = { page: number; pageSize: number };

export const mailKeys = {
  all: ['mail'] as const,
  lists: () => [...mailKeys.all, 'list'] as const,
  list: (filters: MailListFilters) => [...mailKeys.lists(), filters] as const,
  details: () => [...mailKeys.all, 'detail'] as const,
  detail: (id: string) => [...mailKeys.details(), id] as const,
  status: () => [...mailKeys.all, 'status'] as const,
};
