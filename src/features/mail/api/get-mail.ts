import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { Page } from '../../../../shared/schemas/common';
import type { MailMessage } from '../../../../shared/schemas/mail';
import { api } from '../../../lib/api-client';
import { mailKeys, type MailListFilters } from './keys';

/** Newest first, as the server sends them. */
export function getMail(filters: MailListFilters, signal?: AbortSignal) {
  return api.get<Page<MailMessage>>('/api/mail', { query: filters, signal });
}

export const mailQueryOptions = (filters: MailListFilters) =>
  queryOptions({
    queryKey: mailKeys.list(filters),
    queryFn: ({ signal }) => getMail(filters, signal),
    placeholderData: keepPreviousData,
    // The coordinator often waits here for a message Heelwood just sent.
    refetchInterval: 15_000,
  });

export function useMail(filters: MailListFilters) {
  return useQuery(mailQueryOptions(filters));
}

/** A plain link: the browser downloads with the session cookie, no script needed. */
export function attachmentUrl(messageId: string, index: number): string {
  return `/api/mail/${encodeURIComponent(messageId)}/attachments/${index}`;
}
