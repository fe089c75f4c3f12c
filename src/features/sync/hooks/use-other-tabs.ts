import { useEffect } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { OutboxEntry } from '@/lib/outbox';
import { useOutbox } from '@/lib/outbox-context';
import { INVALIDATES } from '@/app/outbox';

const CHANNEL = 'scrubline-outbox';

/**
 * What a tab's list is, for telling whether it changed: each entry's key, state and what it sends (an edit of a
 * run not sent yet is folded into the waiting entry, keeping its key).
 */
const signature = (entries: readonly OutboxEntry[]) => JSON.stringify(entries.map((e) => [e.key, e.state, e.attempts, e.body]));

/**
 * Every tab of the app writes to the one outbox on the device, but each shows its own copy of it. Whenever a
 * tab's copy changes, it tells the others (BroadcastChannel), and they read the device again: a run logged in
 * one tab shows as waiting in the other, and the other's next run number steps past it. A change that left
 * the device meanwhile (sent or discarded by the other tab) has its data read again from the server, as in
 * the tab that sent it. A tab whose copy did not change stays quiet, so the telling stops after one answer.
 */
export function useOtherTabs(): void {
  const outbox = useOutbox();
  const queryClient = useQueryClient();
  useEffect(() => {
    if (typeof BroadcastChannel === 'undefined') return;
    const channel = new BroadcastChannel(CHANNEL);
    let told = signature(outbox.getSnapshot());
    const unsubscribe = outbox.subscribe(() => {
      const now = signature(outbox.getSnapshot());
      if (now === told) return;
      told = now;
      channel.postMessage('changed');
    });
    channel.onmessage = async () => {
      const before = outbox.getSnapshot();
      await outbox.reload();
      const after = outbox.getSnapshot();
      // Read again only what the vanished changes touched, letting reads already on their way finish.
      const gone = before.filter((e) => !after.some((a) => a.key === e.key));
      const keys = new Set(gone.flatMap((e) => INVALIDATES[e.kind.split('.')[0]!] ?? []).map((k) => k[0]!));
      for (const key of keys) void queryClient.invalidateQueries({ queryKey: [key] }, { cancelRefetch: false });
    };
    return () => {
      unsubscribe();
      channel.close();
    };
  }, [outbox, queryClient]);
}
