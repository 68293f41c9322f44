import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MailboxStatus } from '../../../../shared/schemas/mail';
import { api } from '../../../lib/api-client';
import { mailKeys } from './keys';

export function getMailStatus(signal?: AbortSignal) {
  return api.get<MailboxStatus>('/api/mail/status', { signal });
}

export const mailStatusQueryOptions = () =>
  queryOptions({
    queryKey: mailKeys.status(),
    queryFn: ({ signal }) => getMailStatus(signal),
    staleTime: 5 * 60_000,
  });

export function useMailStatus() {
  return useQuery(mailStatusQueryOptions());
}
