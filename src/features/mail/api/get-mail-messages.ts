import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { type Page, type PageInput, pageSchema, pageSearch } from '../../../../shared/schemas/pagination.ts';
import { api } from '../../../lib/api-client.ts';
import { mailKeys } from './keys.ts';

const mailSummarySchema = z.object({ id: z.string(), to: z.string(), from: z.string(), subject: z.string(), date: z.string() });
export type MailSummary = z.infer<typeof mailSummarySchema>;

/** GET /api/admin/mail: one page of the captured messages, newest first. */
export async function getMailMessages(p: PageInput, signal?: AbortSignal): Promise<Page<MailSummary>> {
  const qs = pageSearch(p).toString();
  return pageSchema(mailSummarySchema).parse(await api.get<unknown>(`/api/admin/mail${qs ? `?${qs}` : ''}`, { signal }));
}

export const getMailMessagesQueryOptions = (p: PageInput = {}) =>
  queryOptions({ queryKey: mailKeys.list(p), queryFn: ({ signal }) => getMailMessages(p, signal), staleTime: 5_000, placeholderData: keepPreviousData });

export function useMailMessages(p: PageInput = {}) {
  return useQuery(getMailMessagesQueryOptions(p));
}
