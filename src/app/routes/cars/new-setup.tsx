import { useCallback, useMemo, useState } from 'react';
import { useNavigate, useParams, useSearchParams } from 'react-router-dom';
import { pathTo } from '@/config/paths';
import { EmptyState } from '@/components/ui/empty-state';
import type { OutboxEntry } from '@/lib/outbox';
import { useOutboxEntriesFor } from '@/lib/outbox-context';
import { toast } from '@/lib/toast-store';
import { useMe } from '@/features/auth/api/get-me';
import { useCar } from '@/features/cars/api/get-car';
import { CarNotFound, carIsHidden } from '@/features/cars/components/car-not-found';
import { useSetups } from '@/features/setups/api/get-setups';
import { SetupEditor } from '@/features/setups/components/setup-editor';
import { mergePendingSetups } from '@/features/setups/utils/setup-views';
import { BackLink } from '@/components/ui/back-link';

/** A new setup snapshot (?from=<setupId> to start from an older one; ?fix=<entry> to fix a refused one). */
export function NewSetupPage() {
  const { carId = '' } = useParams();
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const { data: me } = useMe();
  const car = useCar(carId);
  const setups = useSetups(carId);
  const entries = useOutboxEntriesFor({ carId });
  const fixKey = params.get('fix');
  const found = fixKey ? (entries.find((e) => e.key === fixKey && e.kind === 'setup.create') ?? null) : null;
  // Kept once found: after the fixed setup uploads, its entry is gone but the editor still says so.
  const [kept, setKept] = useState<OutboxEntry | null>(null);
  if (found && kept?.key !== found.key) setKept(found);
  const fixEntry = found ?? (kept?.key === fixKey ? kept : null);
  const views = useMemo(
    () => mergePendingSetups(setups.data?.items ?? [], entries, { id: me?.id ?? '', displayName: me?.displayName ?? 'You' }),
    [setups.data, entries, me],
  );
  // Back on the car page at the new setup, not where the editor was scrolled to (the history scrolls to it).
  const onUploaded = useCallback(
    (setupId: string) => {
      toast({ tone: 'success', title: 'Setup saved' });
      void navigate(`${pathTo.car(carId)}#setup-${setupId}`);
    },
    [navigate, carId],
  );

  if (!car.data && carIsHidden(car.error)) return <CarNotFound />;
  const loading = car.isPending || (setups.isPending && !setups.isError);
  return (
    <div className="flex flex-col gap-6">
      <title>New setup · Scrubline</title>
      <div className="flex flex-col gap-2">
        <BackLink to={pathTo.car(carId)}>{car.data?.name ?? 'Car'}</BackLink>
        <h1 className="text-3xl font-extrabold">{fixKey ? 'Fix a refused setup' : 'New setup'}</h1>
      </div>
      {loading ? (
        <p className="text-ink-muted">Loading the car and its setups…</p>
      ) : !car.data ? (
        <EmptyState message="This car could not be loaded. Try again when you have signal." />
      ) : fixKey && !fixEntry ? (
        <EmptyState message="That refused setup is no longer waiting on this phone: it was fixed or discarded." />
      ) : (
        <SetupEditor
          key={fixKey ?? params.get('from') ?? 'new'}
          car={car.data}
          setups={views}
          fromId={params.get('from')}
          fixEntry={fixEntry}
          onUploaded={onUploaded}
        />
      )}
    </div>
  );
}
