import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { MailMessage } from '@/api/contract';
import { apiClient, unwrap } from '@/lib/api-client';

export const mailKeys = {
  all: ['mail'] as const,
  list: () => [...mailKeys.all, 'list'] as const,
};

/** The e-mails the local SMTP fake received, newest first. */
export async function getMail(): Promise<MailMessage[]> {
  const messages = await unwrap(apiClient.GET('/api/local/mail'));
  return [...messages].sort((a, b) => Date.parse(b.date) - Date.parse(a.date));
}

export const mailQueryOptions = () =>
  queryOptions({
    queryKey: mailKeys.list(),
    queryFn: getMail,
    staleTime: 5_000,
  });

export function useMail() {
  return useSuspenseQuery(mailQueryOptions());
}
