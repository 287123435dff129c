import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api.ts';

export interface CaughtMessage {
  id: string;
  to: string;
  subject: string;
  text: string;
  receivedAt: string;
}

export interface CaughtMail {
  /** False outside development and test: mail really goes out and nothing is caught. */
  enabled: boolean;
  messages: CaughtMessage[];
}

/** `GET /api/admin/mail` → what the local mail catcher received. */
export async function getMail(): Promise<CaughtMail> {
  const res = await api.get<CaughtMail>('/admin/mail');
  return { enabled: Boolean(res?.enabled), messages: res?.messages ?? [] };
}

export function mailQueryOptions() {
  return queryOptions({ queryKey: ['admin', 'mail'] as const, queryFn: getMail, refetchInterval: 10_000 });
}

export function useMail() {
  return useQuery(mailQueryOptions());
}
