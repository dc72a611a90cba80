import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client.ts';
import { mailKeys } from './keys.ts';

const mailSummarySchema = z.object({ id: z.string(), to: z.string(), from: z.string(), subject: z.string(), date: z.string() });
export type MailSummary = z.infer<typeof mailSummarySchema>;

export async function getMailMessages(signal?: AbortSignal): Promise<MailSummary[]> {
  const data = z.object({ messages: z.array(mailSummarySchema) }).parse(await api.get<unknown>('/api/admin/mail', { signal }));
  return data.messages;
}

export const getMailMessagesQueryOptions = () =>
  queryOptions({ queryKey: mailKeys.list(), queryFn: ({ signal }) => getMailMessages(signal), staleTime: 5_000 });

export function useMailMessages() {
  return useQuery(getMailMessagesQueryOptions());
}
