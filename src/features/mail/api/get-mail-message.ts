import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client.ts';
import { mailKeys } from './keys.ts';

const mailMessageSchema = z.object({
  id: z.string(),
  to: z.string(),
  from: z.string(),
  subject: z.string(),
  date: z.string(),
  html: z.string().nullable().optional(),
  text: z.string().nullable().optional(),
});
export type MailMessage = z.infer<typeof mailMessageSchema>;

export async function getMailMessage(id: string, signal?: AbortSignal): Promise<MailMessage> {
  return mailMessageSchema.parse(await api.get<unknown>(`/api/admin/mail/${encodeURIComponent(id)}`, { signal }));
}

export const getMailMessageQueryOptions = (id: string) => queryOptions({ queryKey: mailKeys.detail(id), queryFn: ({ signal }) => getMailMessage(id, signal), staleTime: Infinity });

export function useMailMessage(id: string | null) {
  return useQuery({ ...getMailMessageQueryOptions(id ?? ''), enabled: Boolean(id) });
}
