import { lazy, startTransition, Suspense, useEffect, useState } from 'react';
import { Link, useParams, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { useQuery, type QueryClient } from '@tanstack/react-query';
import type { DeviceState } from '@/app/router';
import { Plus } from 'lucide-react';
import type { Person } from '@shared/season/car.schema';
import { formatRunTime } from '@shared/season/run-time';
import { paths, pathTo } from '@/config/paths';
import { Button, buttonClasses } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { PendingBadge } from '@/components/ui/pending-badge';
import { SectionBoundary } from '@/components/errors/section-boundary';
import { notYetFetched, useDeliveredEntries } from '@/lib/delivered-entries';
import { useOutboxEntriesFor } from '@/lib/outbox-context';
import { readStoredChoice, writeStoredChoice } from '@/lib/stored-choice';
import type { ApiError } from '@/lib/api-client';
import { formatDay, isOnDate, prepareDateFormats, runMoment } from '@/lib/dates';
import { useMe } from '@/features/auth/api/get-me';
import { CarDriverPicker, driversOf } from '@/features/cars/components/car-driver-picker';
import { useCarViews } from '@/features/cars/hooks/use-car-views';
import type { CarView } from '@/features/cars/utils/pending-cars';
import { CommentsButton } from '@/features/comments/components/comments-button';
import { NEW_CAR_PATH } from '@/features/cars/utils/new-car-path';
import { EventConditions, EventFacts } from '@/features/events/components/event-facts';
import { useDayEvent } from '@/features/events/hooks/use-event-views';
import { eventQueryOptions } from '@/features/events/api/get-event';
import { carsQueryOptions } from '@/features/cars/api/get-cars';
import type { EventView } from '@/features/events/utils/pending-events';
import { runsQueryOptions } from '@/features/runs/api/get-runs';
import { LogRunForm } from '@/features/runs/components/log-run-form';
import { RunList } from '@/features/runs/components/run-list';
import { mergeRuns, type RunRow } from '@/features/runs/utils/merge-runs';
import { setupsQueryOptions } from '@/features/setups/api/get-setups';
import { CurrentSetup } from '@/features/setups/components/current-setup';
import { mergePendingSetups, setupInForce } from '@/features/setups/utils/setup-views';

// Loaded on the first tap of "Quick change", so logging runs stays a small download (the service worker keeps it for offline).
const QuickChangePanel = lazy(async () => ({
  default: (await import('@/features/setups/components/quick-change-panel')).QuickChangePanel,
}));

interface Choice {
  carId: string;
  driverId: string;
}

const choiceKey = (eventId: string) => `scrubline.event-day.${eventId}`;

/**
 * The page's reads start as soon as its address is known, beside the sign-in check, instead of after
 * its first render and then after the event and the car arrive (two round trips less before the
 * runs show). Nothing waits on them here: the page still renders from the cache or shows its loading.
 * The car list needs nothing from the device; the rest waits until the outbox is read, since an
 * event still on the phone is not asked for.
 */
export const eventDayLoader =
  (queryClient: QueryClient, device: DeviceState) =>
  async ({ params: { eventId = '' }, request }: LoaderFunctionArgs) => {
    void queryClient.prefetchQuery(carsQueryOptions());
    // The platform's first date formatter takes a few hundred ms on a slow phone: built now, it
    // overlaps the wait for the device and the network instead of delaying the first drawing.
    prepareDateFormats();
    await device.read;
    // An event or a car still on the phone: the server cannot know it or its runs yet.
    if (device.waiting(eventId)) return null;
    const carId = new URL(request.url).searchParams.get('carId') ?? readStoredChoice<Choice>(choiceKey(eventId))?.carId;
    void queryClient.prefetchQuery(eventQueryOptions(eventId));
    if (carId && !device.waiting(carId)) {
      void queryClient.prefetchQuery(setupsQueryOptions(carId));
      void queryClient.prefetchQuery(runsQueryOptions({ carId, eventId }));
    }
    return null;
  };

/** Everything under the header once the car and the driver are known. */
function EventDayBoard({ event, car, driver, me }: { event: EventView; car: CarView; driver: Person; me: Person }) {
  const entries = useOutboxEntriesFor({ carId: car.id });
  // A car or an event still on the phone is not on the server yet: its reads wait for the upload, not a refusal.
  const carSaved = !car.pending;
  const onServer = carSaved && !event.pending;
  const setupsQuery = useQuery({ ...setupsQueryOptions(car.id), enabled: carSaved });
  const runsQuery = useQuery({ ...runsQueryOptions({ carId: car.id, eventId: event.id }), enabled: onServer });
  const [quickChange, setQuickChange] = useState(false);

  // Just uploaded, but not in the data yet: kept in view until the refresh lands, so nothing blinks out.
  const delivered = useDeliveredEntries();
  const ofCar = delivered.filter((d) => d.entry.scope.carId === car.id);
  const setupsDelivered = notYetFetched(ofCar, setupsQuery.dataUpdatedAt).filter((e) => e.kind.startsWith('setup.'));
  const runsDelivered = notYetFetched(ofCar, runsQuery.dataUpdatedAt).filter((e) => e.scope.eventId === event.id && e.kind.startsWith('run.'));

  const setups = mergePendingSetups(setupsQuery.data?.items ?? [], entries, me, setupsDelivered);
  const rows = mergeRuns({
    saved: runsQuery.data?.items ?? [],
    delivered: runsDelivered,
    entries: entries.filter((e) => e.scope.eventId === event.id && e.kind.startsWith('run.')),
    people: driversOf(car),
    conePenaltySec: event.conePenaltySec,
  });
  // After the event's day, runs logged are tied to the setup the car ended that day with (runMoment).
  const moment = runMoment(event.date);
  const current = setupInForce(setups, moment.at.toISOString());

  // The server ties saved runs; runs still on the phone — and any run after a quick change still on
  // the phone — are tied here by the same rule: the snapshot with the latest start not after the run.
  const setupLabelOf = (row: RunRow): string | null => {
    const tie = setupInForce(setups, row.recordedAt);
    if (row.version === null || row.pending || tie?.pending) return tie?.label ?? null;
    return setups.find((s) => s.id === row.setupId)?.label ?? tie?.label ?? null;
  };

  // Only runs the server has can carry a thread.
  const runComments = (row: RunRow) => {
    const saved = row.pending ? undefined : runsQuery.data?.items.find((r) => r.id === row.id);
    return saved ? <CommentsButton target={{ type: 'run', id: row.id }} what={`run ${row.runNumber}`} count={saved.commentCount} /> : null;
  };

  // The board is drawn in steps, each a render React may interrupt, so that what is above it is on screen
  // first: the event's name (the page's largest text) is not held back while a slow phone lays out the keypad.
  // Step 1 draws the setup line and the keypad. The run list is most of the page's elements: on the day it
  // follows in step 2, so the keypad answers a tap sooner; after the day the list comes first, above the
  // keypad, and is drawn in step 1 so the keypad does not jump down.
  const [step, setStep] = useState(0);
  const listDrawn = step > 1 || moment.dayOver;
  useEffect(() => {
    if (!listDrawn || !step) startTransition(() => setStep(step + 1));
  }, [step, listDrawn]);

  // How tall the setup line is depends on the setup's name: the board waits while the car's setups are on
  // their way, so the keypad never moves under a thumb when they land. With no signal they are not coming.
  if (!step || (setupsQuery.isPending && setupsQuery.fetchStatus === 'fetching' && setups.length === 0)) return <p className="text-ink-muted">Loading…</p>;

  const own = rows.filter((r) => r.driver.id === driver.id);
  const best = own.find((r) => r.isBest);
  // Opened after the day (to tidy up the runs, or to read them), the list is not today's.
  const heading = isOnDate(new Date(), event.date) ? 'Today’s runs' : `Runs on ${formatDay(event.date)}`;

  const logRun = (
    <section key="log" aria-label="Log a run" className="rounded-lg border border-line bg-surface p-3 md:sticky md:top-20 md:order-2">
      {moment.dayOver ? <h2 className="mb-2 text-lg font-bold">Add a run from that day</h2> : null}
      <LogRunForm carId={car.id} eventId={event.id} eventDate={event.date} driver={driver} conePenaltySec={event.conePenaltySec} rows={rows} />
    </section>
  );
  const runList = (
    <section key="runs" aria-labelledby="runs" className="flex flex-col gap-3 md:order-1">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="runs" className="text-xl font-bold">
          {heading}
        </h2>
        {event.pending ? null : <CommentsButton target={{ type: 'event', id: event.id, carId: car.id }} what={`${car.name} at ${event.name}`} />}
        {best?.adjustedTimeSec != null ? (
          <p className="tabular-figures font-semibold">
            {driver.displayName}’s best: <span className="text-time">{formatRunTime(best.adjustedTimeSec)}</span> (run {best.runNumber})
          </p>
        ) : null}
      </div>
      {runsQuery.isError && !runsQuery.data ? (
        <p className="text-sm text-ink-muted">Saved runs could not be loaded (no connection?). Runs you log now are kept on this phone.</p>
      ) : null}
      {(onServer && runsQuery.isPending && rows.length === 0) || !listDrawn ? (
        <p className="text-ink-muted">Loading runs…</p>
      ) : (
        <RunList label={heading} rows={rows} setupLabelOf={setupLabelOf} renderExtras={runComments} />
      )}
    </section>
  );

  return (
    <>
      <section aria-label="Setup" className="flex flex-col gap-3 rounded-lg border border-line bg-surface px-3 py-2">
        <div className="flex items-center justify-between gap-3">
          <CurrentSetup setup={current} loading={carSaved && setupsQuery.data === undefined && setups.length === 0} day={event.date} dayOver={moment.dayOver} />
          {/* A quick change starts now; one made on a past day is entered, with its time, in the setup editor. */}
          {moment.dayOver ? (
            <Link to={pathTo.newSetup(car.id, current?.id)} className={buttonClasses('secondary', 'shrink-0 px-3')}>
              Add a change
            </Link>
          ) : (
            <Button variant="secondary" className="shrink-0 px-3" aria-expanded={quickChange} onClick={() => setQuickChange((v) => !v)}>
              Quick change
            </Button>
          )}
        </div>
        {quickChange && !moment.dayOver ? (
          <Suspense fallback={<p className="text-ink-muted">Opening…</p>}>
            <QuickChangePanel
              carId={car.id}
              adjusters={car.damperAdjusters}
              setups={setups}
              onDone={() => setQuickChange(false)}
            />
          </Suspense>
        ) : null}
      </section>

      <div className="grid grid-cols-1 gap-4 md:grid-cols-[minmax(0,1fr)_24rem] md:items-start">
        {/* On the day the keypad comes first; opened afterwards, the day's results do, with the keypad below them. */}
        {moment.dayOver ? [runList, logRun] : [logRun, runList]}
      </div>
    </>
  );
}

/**
 * The trackside screen: pick the car and the driver once (remembered on this phone for the
 * event), then log runs, see today's times scored, and make quick setup changes.
 */
export function EventDayPage() {
  const { eventId = '' } = useParams();
  const [params, setParams] = useSearchParams();
  const { data: me } = useMe();
  // An event made on this phone shows from the outbox until the server has it; runs logged into it queue behind it.
  const eventQuery = useDayEvent(eventId);
  const eventError = eventQuery.error as ApiError;
  // So do cars made on this phone: a driver can start from nothing with no signal.
  const carsQuery = useCarViews({ id: me?.id ?? '', displayName: me?.displayName ?? 'You' });
  const [stored, setStored] = useState(() => readStoredChoice<Choice>(choiceKey(eventId)));
  const [picking, setPicking] = useState(false);

  const cars = carsQuery.cars;
  // One car that only its owner drives leaves nothing to choose: the board opens straight away.
  const only = cars.length === 1 && driversOf(cars[0]!).length === 1 ? { carId: cars[0]!.id, driverId: cars[0]!.owner.id } : null;
  const carId = params.get('carId') ?? stored?.carId ?? only?.carId ?? null;
  const car = cars.find((c) => c.id === carId) ?? null;
  const drivers = car ? driversOf(car) : [];
  // The address holds both, so a reload, Back or a shared link opens the same board; this phone remembers them too.
  const driverId = params.get('driverId') ?? (stored?.carId === carId ? stored.driverId : null) ?? (only?.carId === carId ? only.driverId : null);
  const driver = drivers.find((d) => d.id === driverId) ?? null;

  const choose = (choice: Choice) => {
    writeStoredChoice(choiceKey(eventId), choice);
    setStored(choice);
    setPicking(false);
    setParams({ carId: choice.carId, driverId: choice.driverId }, { replace: true });
  };

  const event = eventQuery.event;
  if (!me) return null;
  const person: Person = { id: me.id, displayName: me.displayName };

  return (
    <div className="-mt-3 flex flex-col gap-3">
      <title>{`${event?.name ?? 'Event day'} · Scrubline`}</title>
      <header className="flex flex-col">
        <div className="flex items-start justify-between gap-3">
          <h1 className="line-clamp-2 text-xl font-extrabold">{event?.name ?? (eventQuery.isPending ? 'Loading the event…' : 'Event day')}</h1>
          {/* The way to another event or a new one; its tap area overhangs the line, so the keypad stays where it is. */}
          <Link to={paths.events} className="-my-2 inline-flex min-h-tap shrink-0 items-center text-sm font-semibold text-link underline">
            All events
          </Link>
        </div>
        {event ? <EventFacts event={event} /> : null}
        {/* Read back after the day, the conditions it was run in; on the day they would push the keypad under the Save bar. */}
        {event && runMoment(event.date).dayOver ? <EventConditions event={event} /> : null}
        {event?.pending ? (
          <p className="flex flex-wrap items-center gap-x-2 gap-y-1 text-sm">
            <PendingBadge state={event.pending.state} />
            <span className={event.pending.state === 'failed' ? 'font-semibold text-warning' : 'text-ink-muted'}>
              {event.pending.state === 'failed'
                ? `The server refused this event: ${event.pending.error?.message ?? 'no reason given'}. Runs logged at it stay on this phone; see Sync on Home.`
                : 'This event is on this phone only so far; it uploads before the runs logged at it.'}
            </span>
          </p>
        ) : null}
        {/* With the event's facts, which come above it: drawn before them, this line would move down. */}
        {event && car && driver && !picking ? (
          <p className="flex flex-wrap items-center gap-x-2 text-sm font-semibold">
            <span className="wrap-anywhere">
              {car.name}
              {car.carNumber ? <span className="tabular-figures text-ink-muted"> #{car.carNumber}</span> : null} · {driver.displayName}
            </span>
            {only ? null : (
              <button type="button" className="inline-flex min-h-tap items-center text-link underline" onClick={() => setPicking(true)}>
                Change
                <span className="sr-only"> car or driver</span>
              </button>
            )}
          </p>
        ) : null}
      </header>

      {eventQuery.isError && !event ? (
        <EmptyState
          message={
            // What the server answered, if it did: "no signal" would send the driver looking for one.
            eventError.status === 404 || eventError.status === 403
              ? 'This event was not found: it may have been deleted, or it is not one you can open.'
              : eventError.status
                ? eventError.message
                : 'This event is not on this phone yet. Open it once with signal to use it offline.'
          }
        >
          <Link to={paths.events} className="font-semibold text-link underline">
            All events
          </Link>
        </EmptyState>
      ) : !event || carsQuery.isPending ? (
        <p className="text-ink-muted">Loading…</p>
      ) : cars.length === 0 ? (
        <EmptyState
          message={
            carsQuery.isError
              ? 'Your cars could not be loaded, and none are kept on this phone yet. Try again when you have signal, or add your car now.'
              : 'You have no cars to log runs for. Add yours (it works with no signal); a car you co-drive shows here once its owner adds you.'
          }
        >
          {/* The event goes with it, so saving the car comes back here with it chosen. */}
          <Link to={NEW_CAR_PATH} state={eventId} className={buttonClasses('primary', 'self-start')}>
            <Plus aria-hidden="true" className="size-5" /> Add a car
          </Link>
        </EmptyState>
      ) : !car || !driver || picking ? (
        <section aria-label="Choose car and driver" className="rounded-lg border border-line bg-surface p-4">
          <CarDriverPicker
            cars={cars}
            currentUserId={me.id}
            initialCarId={carId}
            initialDriverId={driverId}
            onChoose={choose}
            action={runMoment(event.date).dayOver ? 'Open that day’s runs' : 'Start logging'}
          />
        </section>
      ) : (
        <SectionBoundary title="Event day">
          <EventDayBoard event={event} car={car} driver={driver} me={person} />
        </SectionBoundary>
      )}
    </div>
  );
}
