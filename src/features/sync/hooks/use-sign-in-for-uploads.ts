import { useEffect } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { SIGNED_OUT_REASON } from '@/app/outbox';
import { useOutbox } from '@/lib/outbox-context';
import { authKeys } from '@/features/auth/api/auth-keys';

/**
 * An upload refused because the session is over (it expired, or was signed out from another device) asks the
 * server again who is signed in. The answer "nobody" sends the page to sign in, as a refused read does, where
 * the runs still on the phone are counted; they upload once the driver is back. Without this, a driver logging
 * at the car would see only "2 waiting" grow while nothing could upload.
 */
export function useSignInForUploads(): void {
  const outbox = useOutbox();
  const queryClient = useQueryClient();
  useEffect(() => {
    let asked = false;
    const check = () => {
      const signedOut = outbox.retryReason() === SIGNED_OUT_REASON;
      if (signedOut && !asked) void queryClient.invalidateQueries({ queryKey: authKeys.me() });
      asked = signedOut;
    };
    // This part of the shell loads after the page: a refusal that came before it is looked at at once.
    check();
    return outbox.subscribe(check);
  }, [outbox, queryClient]);
}
