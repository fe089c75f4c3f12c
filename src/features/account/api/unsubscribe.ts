import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

/** Turns notification e-mails off for whoever the e-mailed link belongs to; no sign-in needed. */
export function unsubscribe(token: string): Promise<void> {
  return api.post(`/api/unsubscribe/${encodeURIComponent(token)}`);
}

export function useUnsubscribe(token: string) {
  return useMutation({ mutationFn: () => unsubscribe(token), networkMode: 'always', meta: { errorsShownInline: true } });
}
