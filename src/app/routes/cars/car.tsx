import { lazy, Suspense, useMemo, useState } from 'react';
import { Link, Navigate, useLocation, useNavigate, useParams, useSearchParams } from 'react-router-dom';
import { ChartScatter, FileUp, Plus, Ruler, Settings } from 'lucide-react';
import type { Car } from '@shared/season/car.schema';
import { paths, pathTo } from '@/config/paths';
import { EDIT_PARAM, recordPath } from '@/config/record-paths';
import { Button, buttonClasses } from '@/components/ui/button';
import { SectionBoundary } from '@/components/errors/section-boundary';
import { useOutboxEntriesFor } from '@/lib/outbox-context';
import { AttachmentToggle } from '@/features/attachments/components/attachment-toggle';
import { useMe } from '@/features/auth/api/get-me';
import { useCar } from '@/features/cars/api/get-car';
import { CarHeader } from '@/features/cars/components/car-header';
import { CoDrivers } from '@/features/cars/components/co-drivers';
import { drivesCar } from '@/features/cars/utils/car-page-path';
import { CarNotFound, carIsHidden } from '@/features/cars/components/car-not-found';
import { useSetups } from '@/features/setups/api/get-setups';
import { SetupTimeline } from '@/features/setups/components/setup-timeline';
import { mergePendingSetups } from '@/features/setups/utils/setup-views';
import { NewTyreSetForm } from '@/features/tyres/components/new-tyre-set-form';
import { TyreSetList } from '@/features/tyres/components/tyre-set-list';
import { useTyreSetViews } from '@/features/tyres/hooks/use-tyre-set-views';
import { useChanges } from '@/features/changes/api/get-changes';
import { ChangeLog } from '@/features/changes/components/change-log';
import { CommentToggle } from '@/features/comments/components/comment-toggle';
import { ShopAccess } from '@/features/shops/components/shop-access';
import { OpenSuggestions, SuggestionList } from '@/features/suggestions/components/suggestion-list';
import { CarVisits } from '@/features/work-orders/components/work-order-lists';
// Season export
import { useQueryClient } from '@tanstack/react-query';
import { carKeys } from '@/features/cars/api/car-keys';
import { SeasonData } from '@/features/exports/components/season-data';
import { refreshAfterWrite } from '@/lib/refresh-after-write';
import { CardSection } from '@/components/layouts/card-section';

/** A setup's thread the page was opened for (a notification's link, `?comments=<setup id>`): open, and scrolled to. */
function SetupSection({ carId }: { carId: string }) {
  const [params] = useSearchParams();
  const threadId = params.get('comments');
  const { data: me } = useMe();
  const { data: car } = useCar(carId);
  const { data, isPending, isError } = useSetups(carId);
  const entries = useOutboxEntriesFor({ carId });
  const setups = useMemo(
    () => mergePendingSetups(data?.items ?? [], entries, { id: me?.id ?? '', displayName: me?.displayName ?? 'You' }),
    [data, entries, me],
  );
  if (isPending && entries.length === 0) return <p className="text-ink-muted">Loading the setup history…</p>;
  if (isError && setups.length === 0) return <p className="text-ink-muted">The setup history could not be loaded. Try again shortly.</p>;
  return (
    <SetupTimeline
      carId={carId}
      setups={setups}
      revealedId={threadId}
      adjusters={car?.damperAdjusters}
      // A snapshot still on this phone has no thread (nor photos) on the server yet.
      renderExtras={(setup) =>
        setup.pending ? null : (
          <>
            <AttachmentToggle target={{ targetType: 'setup', targetId: setup.id }} what={`“${setup.label}”`} />
            <CommentToggle target={{ type: 'setup', id: setup.id }} what={`“${setup.label}”`} revealed={threadId === setup.id} />
          </>
        )
      }
    />
  );
}

function TyreSection({ carId, car }: { carId: string; car: Car | undefined }) {
  const { sets, entries, isPending, isError } = useTyreSetViews(carId);
  const [adding, setAdding] = useState(false);
  return (
    <div className="flex flex-col gap-4">
      {isPending ? (
        <p className="text-ink-muted">Loading tyre sets…</p>
      ) : isError ? (
        <p className="text-ink-muted">Tyre sets could not be loaded. Try again shortly.</p>
      ) : (
        <TyreSetList carId={carId} sets={sets} entries={entries} />
      )}
      {adding ? (
        <NewTyreSetForm carId={carId} defaultSize={car?.tyreSize ?? null} onSaved={() => setAdding(false)} onCancel={() => setAdding(false)} />
      ) : (
        <div>
          <Button variant="secondary" onClick={() => setAdding(true)}>
            <Plus aria-hidden="true" className="size-5" /> New tyre set
          </Button>
        </div>
      )}
    </div>
  );
}

function ChangeSection({ carId }: { carId: string }) {
  const { data, isPending, isError } = useChanges(carId);
  const entries = useOutboxEntriesFor({ carId });
  if (isPending && entries.length === 0) return <p className="text-ink-muted">Loading the change log…</p>;
  if (isError && entries.length === 0) return <p className="text-ink-muted">The change log could not be loaded. Try again shortly.</p>;
  return <ChangeLog carId={carId} saved={data?.items ?? []} entries={entries} />;
}

/** Season export: the downloads, and a file brought in as a new car (then opened). */
function DataSection({ carId }: { carId: string }) {
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  return (
    <SeasonData
      carId={carId}
      onImported={async ({ carId: newCarId }) => {
        await refreshAfterWrite(queryClient, { queryKey: carKeys.all });
        await navigate(pathTo.car(newCarId));
      }}
    />
  );
}

/** One car: its setup history, its tyres, its drivers, and its change log. */
// The car's own details and deleting it (`?edit=1`), loaded only when asked for.
const EditCarPage = lazy(async () => ({ default: (await import('./car-details-pages')).EditCarPage }));

export function CarPage() {
  const { carId = '' } = useParams();
  const { data: car, isPending, isError, error } = useCar(carId);
  const { data: me } = useMe();
  const location = useLocation();
  const [params] = useSearchParams();
  // Shop staff reading a customer's car (a link to a setup, a comment, an old address) get the shop's page of it,
  // where nothing offers them a driver's change they may not make; the thread or setup asked for comes with it.
  if (car && me && !drivesCar(car, me.id)) return <Navigate to={`${recordPath.shopCustomer(carId)}${location.search}${location.hash}`} replace />;
  if (!car && carIsHidden(error)) return <CarNotFound />;
  if (params.has(EDIT_PARAM)) {
    return (
      <Suspense fallback={<p className="text-ink-muted">Loading…</p>}>
        <EditCarPage />
      </Suspense>
    );
  }
  return (
    <div className="flex flex-col gap-6">
      <title>{`${car?.name ?? 'Car'} · Scrubline`}</title>
      <CarHeader
        car={car}
        isPending={isPending}
        isError={isError}
        back={{ to: paths.cars, label: 'Cars' }}
        about={(c) => <>driven by {[c.owner, ...c.coDrivers].map((p) => p.displayName).join(', ')}</>}
        errorText="This car could not be loaded."
      >
        <Link to={pathTo.newSetup(carId)} className={buttonClasses('primary')}>
          <Plus aria-hidden="true" className="size-5" /> New setup
        </Link>
        <Link to={recordPath.tread(carId)} className={buttonClasses('secondary')}>
          <Ruler aria-hidden="true" className="size-5" /> Enter tread
        </Link>
        <Link to={recordPath.review(carId)} className={buttonClasses('secondary')}>
          <ChartScatter aria-hidden="true" className="size-5" /> Season review
        </Link>
        <Link to={recordPath.importResults(carId)} className={buttonClasses('secondary')}>
          <FileUp aria-hidden="true" className="size-5" /> Import results
        </Link>
        {car && me && car.owner.id === me.id ? (
          <Link to={recordPath.editCar(carId)} className={buttonClasses('secondary')}>
            <Settings aria-hidden="true" className="size-5" /> Edit car
          </Link>
        ) : null}
      </CarHeader>
      {/* What waits for the driver's answer comes first, above the season's records. */}
      <SectionBoundary title="Waiting for you">
        <OpenSuggestions carId={carId} />
      </SectionBoundary>
      <div className="grid grid-cols-1 gap-4 lg:grid-cols-2">
        <CardSection title="Setup history">
          <SetupSection carId={carId} />
        </CardSection>
        <div className="flex flex-col gap-4">
          <CardSection title="Tyres">
            <TyreSection carId={carId} car={car} />
          </CardSection>
          {car && me ? (
            <CardSection title="Drivers">
              <CoDrivers car={car} currentUserId={me.id} />
            </CardSection>
          ) : null}
          {car && me ? (
            <CardSection title="Shop access">
              <ShopAccess carId={carId} isOwner={car.owner.id === me.id} ownerName={car.owner.displayName} />
            </CardSection>
          ) : null}
          <CardSection title="Suggestions from shops">
            <SuggestionList carId={carId} emptyText="No suggestions yet. A shop you let in can suggest setup changes here." forDriver />
          </CardSection>
          <CardSection title="Shop visits">
            <CarVisits carId={carId} />
          </CardSection>
          <CardSection title="Change log">
            <ChangeSection carId={carId} />
          </CardSection>
          <CardSection title="Your data">
            <DataSection carId={carId} />
          </CardSection>
        </div>
      </div>
    </div>
  );
}
