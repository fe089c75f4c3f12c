import { useMemo } from 'react';
import { Link, useParams } from 'react-router-dom';
import { ArrowLeft, Plus, Ruler } from 'lucide-react';
import { paths, pathTo } from '@/config/paths';
import { buttonClasses } from '@/components/ui/button';
import { SectionCard } from '@/components/ui/section-card';
import { SectionBoundary } from '@/components/errors/section-boundary';
import { useOutboxEntriesFor } from '@/lib/outbox-context';
import { useMe } from '@/features/auth/api/get-me';
import { useCar } from '@/features/cars/api/get-car';
import { useSetups } from '@/features/setups/api/get-setups';
import { SetupTimeline } from '@/features/setups/components/setup-timeline';
import { mergePendingSetups } from '@/features/setups/utils/setup-views';
import { useTyreSets } from '@/features/tyres/api/get-tyre-sets';
import { TyreSetList } from '@/features/tyres/components/tyre-set-list';
import { useChanges } from '@/features/changes/api/get-changes';
import { ChangeLog } from '@/features/changes/components/change-log';

function SetupSection({ carId }: { carId: string }) {
  const { data: me } = useMe();
  const { data, isPending, isError } = useSetups(carId);
  const entries = useOutboxEntriesFor({ carId });
  const setups = useMemo(
    () => mergePendingSetups(data?.items ?? [], entries, { id: me?.id ?? '', displayName: me?.displayName ?? 'You' }),
    [data, entries, me],
  );
  if (isPending && entries.length === 0) return <p className="text-ink-muted">Loading the setup history…</p>;
  if (isError && setups.length === 0) return <p className="text-ink-muted">The setup history could not be loaded. Try again shortly.</p>;
  return <SetupTimeline carId={carId} setups={setups} />;
}

function TyreSection({ carId }: { carId: string }) {
  const { data, isPending, isError } = useTyreSets(carId);
  const entries = useOutboxEntriesFor({ carId });
  if (isPending) return <p className="text-ink-muted">Loading tyre sets…</p>;
  if (isError) return <p className="text-ink-muted">Tyre sets could not be loaded. Try again shortly.</p>;
  return <TyreSetList carId={carId} sets={data.items} entries={entries} />;
}

function ChangeSection({ carId }: { carId: string }) {
  const { data, isPending, isError } = useChanges(carId);
  const entries = useOutboxEntriesFor({ carId });
  if (isPending && entries.length === 0) return <p className="text-ink-muted">Loading the change log…</p>;
  if (isError && entries.length === 0) return <p className="text-ink-muted">The change log could not be loaded. Try again shortly.</p>;
  return <ChangeLog carId={carId} saved={data?.items ?? []} entries={entries} />;
}

/** One car: its setup history, its tyres, and its change log. */
export function CarPage() {
  const { carId = '' } = useParams();
  const { data: car, isPending, isError } = useCar(carId);
  return (
    <div className="flex flex-col gap-6">
      <title>{`${car?.name ?? 'Car'} · Scrubline`}</title>
      <div className="flex flex-col gap-2">
        <Link to={paths.cars} className="inline-flex min-h-tap items-center gap-1 self-start font-semibold text-link">
          <ArrowLeft aria-hidden="true" className="size-4" /> Cars
        </Link>
        <h1 className="text-3xl font-extrabold">
          {car ? car.name : isPending ? 'Loading…' : 'Car'}
          {car?.carNumber ? <span className="tabular-figures text-ink-muted"> #{car.carNumber}</span> : null}
        </h1>
        {car ? (
          <p className="text-ink-muted">
            Class {car.classCode}
            {car.tyreSize ? ` · ${car.tyreSize}` : ''} · driven by {[car.owner, ...car.coDrivers].map((p) => p.displayName).join(', ')}
          </p>
        ) : isError ? (
          <p className="text-ink-muted">This car could not be loaded.</p>
        ) : null}
        <div className="flex flex-wrap gap-2 pt-2">
          <Link to={pathTo.newSetup(carId)} className={buttonClasses('primary')}>
            <Plus aria-hidden="true" className="size-5" /> New setup
          </Link>
          <Link to={pathTo.tread(carId)} className={buttonClasses('secondary')}>
            <Ruler aria-hidden="true" className="size-5" /> Enter tread
          </Link>
        </div>
      </div>
      <div className="grid gap-4 lg:grid-cols-2">
        <SectionBoundary title="Setup history">
          <SectionCard title="Setup history">
            <SetupSection carId={carId} />
          </SectionCard>
        </SectionBoundary>
        <div className="flex flex-col gap-4">
          <SectionBoundary title="Tyres">
            <SectionCard title="Tyres">
              <TyreSection carId={carId} />
            </SectionCard>
          </SectionBoundary>
          <SectionBoundary title="Change log">
            <SectionCard title="Change log">
              <ChangeSection carId={carId} />
            </SectionCard>
          </SectionBoundary>
        </div>
      </div>
    </div>
  );
}
