import { useState } from 'react';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import { ChartScatter, ChevronDown, ChevronRight } from 'lucide-react';
import type { SeasonResult } from '@shared/analysis/analysis.schema';
import { formatRunTime } from '@shared/season/run-time';
import { paths } from '@/config/paths';
import { recordPath } from '@/config/record-paths';
import { buttonClasses } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { formatDay } from '@/lib/dates';
import type { OutboxEntry } from '@/lib/outbox';
import { DEFAULT_MIN_DEPTH_MM, useSeason } from '@/features/analysis/api/get-season';
import { AttachmentToggle } from '@/features/attachments/components/attachment-toggle';
import { useCar } from '@/features/cars/api/get-car';
import { CarHeader } from '@/features/cars/components/car-header';
import { CarNotFound, carIsHidden } from '@/features/cars/components/car-not-found';
import { useChanges } from '@/features/changes/api/get-changes';
import { ChangeLog } from '@/features/changes/components/change-log';
import { CommentToggle } from '@/features/comments/components/comment-toggle';
import { useRuns } from '@/features/runs/api/get-runs';
import { HotPressuresToggle } from '@/features/runs/components/hot-pressures-toggle';
import { STATUS_WORDS } from '@/features/runs/utils/run-words';
import { useSetups } from '@/features/setups/api/get-setups';
import { SetupTimeline } from '@/features/setups/components/setup-timeline';
import { SuggestionList } from '@/features/suggestions/components/suggestion-list';
import { useTyreSets } from '@/features/tyres/api/get-tyre-sets';
import { TyreSetList } from '@/features/tyres/components/tyre-set-list';
import { mergeTyreSets } from '@/features/tyres/utils/tyre-set-views';
import { CarVisits, OpenWorkOrderForm } from '@/features/work-orders/components/work-order-lists';
import { CardSection } from '@/components/layouts/card-section';

type SeasonEventRow = SeasonResult['events'][number];

/**
 * The thread the page was opened for (a notification's link): `?event=…&comments=…` for a run's or a day's,
 * whose event then starts with its runs out; `?comments=…` for a setup's.
 */
function useThreadInAddress() {
  const [params] = useSearchParams();
  return { eventId: params.get('event'), threadId: params.get('comments') };
}

/** One event's runs for this car, read-only, each with its thread; and the thread on the car's day. */
function EventRuns({ carId, event, threadId }: { carId: string; event: SeasonEventRow; threadId: string | null }) {
  const { data, isPending, isError } = useRuns({ carId, eventId: event.eventId });
  const { data: setups } = useSetups(carId);
  const labelOf = (setupId: string | null) => setups?.items.find((s) => s.id === setupId)?.label ?? 'none recorded';
  return (
    <div className="flex flex-col gap-3 pt-2">
      <CommentToggle target={{ type: 'event', id: event.eventId, carId }} what={`the day at ${event.name}`} revealed={threadId === event.eventId} />
      <AttachmentToggle target={{ targetType: 'event', targetId: event.eventId }} what={event.name} />
      {isPending ? (
        <p className="text-ink-muted">Loading runs…</p>
      ) : isError ? (
        <p className="text-ink-muted">The runs could not be loaded. Try again shortly.</p>
      ) : data.items.length === 0 ? (
        <p className="text-ink-muted">No runs recorded.</p>
      ) : (
        <ol className="flex flex-col gap-2" aria-label={`Runs at ${event.name}`}>
          {data.items.map((run) => (
            <li key={run.id} className="flex flex-col gap-1 rounded border border-line p-3">
              <p className="tabular-figures flex flex-wrap items-baseline gap-x-3">
                <span className="font-extrabold">Run {run.runNumber}</span>
                <span className="font-semibold text-ink-muted">{run.driver.displayName}</span>
                <span>
                  Raw {run.rawTimeSec === null ? '—' : formatRunTime(run.rawTimeSec)}
                  {run.cones ? ` +${run.cones} cone${run.cones === 1 ? '' : 's'}` : ''}
                </span>
                {/* Labelled as on the driver's run list: the raw time, then the one that counts, cones added. */}
                <span className="font-bold">
                  {run.status === 'finished' && run.adjustedTimeSec !== null ? `Adjusted ${formatRunTime(run.adjustedTimeSec)}` : STATUS_WORDS[run.status]}
                </span>
                {run.isBest ? <span className="text-sm font-bold">Best</span> : null}
              </p>
              <p className="text-sm text-ink-muted">Setup: {labelOf(run.setupId)}</p>
              {run.notes ? <p className="text-sm">{run.notes}</p> : null}
              {/* Came with the run: no request of its own. */}
              {run.hotPressuresKpa ? <HotPressuresToggle kpa={run.hotPressuresKpa} /> : null}
              <CommentToggle
                target={{ type: 'run', id: run.id }}
                what={`run ${run.runNumber}`}
                count={run.commentCount}
                revealed={threadId === run.id}
              />
              <AttachmentToggle target={{ targetType: 'run', targetId: run.id }} what={`run ${run.runNumber}`} />
            </li>
          ))}
        </ol>
      )}
    </div>
  );
}

function EventItem({ carId, event, threadId = null }: { carId: string; event: SeasonEventRow; threadId?: string | null }) {
  const [open, setOpen] = useState(threadId !== null);
  const Chevron = open ? ChevronDown : ChevronRight;
  return (
    <li className="flex flex-col gap-1 rounded border border-line p-3">
      <p className="font-bold wrap-anywhere">{event.name}</p>
      <p className="text-sm text-ink-muted">
        {formatDay(event.date)}
        {event.venue ? ` · ${event.venue}` : ''}
      </p>
      <ul className="tabular-figures text-sm">
        {event.drivers.map((d) => (
          <li key={d.driver.id}>
            {d.driver.displayName}: best {d.bestAdjustedSec === null ? '—' : formatRunTime(d.bestAdjustedSec)} · {d.runCount} run
            {d.runCount === 1 ? '' : 's'}
          </li>
        ))}
      </ul>
      <button
        type="button"
        aria-expanded={open}
        onClick={() => setOpen((v) => !v)}
        className="inline-flex min-h-tap items-center gap-1 self-start font-semibold text-link"
      >
        <Chevron aria-hidden="true" className="size-4" /> Runs and comments
      </button>
      {open ? <EventRuns carId={carId} event={event} threadId={threadId} /> : null}
    </li>
  );
}

function Events({ carId }: { carId: string }) {
  const { data, isPending, isError } = useSeason(carId, DEFAULT_MIN_DEPTH_MM);
  const wanted = useThreadInAddress();
  if (isPending) return <p className="text-ink-muted">Loading the season…</p>;
  if (isError) return <EmptyState message="The season could not be loaded. Try again shortly." />;
  if (data.events.length === 0) return <EmptyState message="No events with runs yet this season." />;
  return (
    <ol className="flex flex-col gap-3" aria-label="Events, newest first">
      {[...data.events].reverse().map((event) => (
        <EventItem key={event.eventId} carId={carId} event={event} threadId={event.eventId === wanted.eventId ? wanted.threadId : null} />
      ))}
    </ol>
  );
}

function Setups({ carId }: { carId: string }) {
  const { data, isPending, isError } = useSetups(carId);
  const { data: car } = useCar(carId);
  const { eventId, threadId } = useThreadInAddress();
  if (isPending) return <p className="text-ink-muted">Loading the setup history…</p>;
  if (isError) return <p className="text-ink-muted">The setup history could not be loaded. Try again shortly.</p>;
  return (
    <SetupTimeline
      carId={carId}
      readOnly
      setups={data.items.map((s) => ({ ...s, pending: null }))}
      revealedId={eventId ? null : threadId}
      adjusters={car?.damperAdjusters}
      renderExtras={(setup) => (
        <>
          <Link to={recordPath.newSuggestion(carId, setup.id)} className={buttonClasses('secondary', 'self-start')}>
            Suggest a change
          </Link>
          <AttachmentToggle target={{ targetType: 'setup', targetId: setup.id }} what={`“${setup.label}”`} />
          <CommentToggle target={{ type: 'setup', id: setup.id }} what={`“${setup.label}”`} revealed={!eventId && threadId === setup.id} />
        </>
      )}
    />
  );
}

/** Nothing of this car waits in the shop's outbox: the drivers record its tyres and changes. */
const NO_ENTRIES: readonly OutboxEntry[] = [];

/** The car's tyre sets as saved: which is on the car, the runs on each and its latest tread, read only. */
function Tyres({ carId }: { carId: string }) {
  const { data, isPending, isError } = useTyreSets(carId);
  if (isPending) return <p className="text-ink-muted">Loading tyre sets…</p>;
  if (isError) return <p className="text-ink-muted">Tyre sets could not be loaded. Try again shortly.</p>;
  return <TyreSetList carId={carId} sets={mergeTyreSets(data.items, NO_ENTRIES)} entries={NO_ENTRIES} readOnly />;
}

/** The car's change log as saved, read only. */
function Changes({ carId }: { carId: string }) {
  const { data, isPending, isError } = useChanges(carId);
  if (isPending) return <p className="text-ink-muted">Loading the change log…</p>;
  if (isError) return <p className="text-ink-muted">The change log could not be loaded. Try again shortly.</p>;
  return <ChangeLog carId={carId} saved={data.items} entries={NO_ENTRIES} readOnly />;
}

/** A customer's car as the shop sees it: the season read-only, with threads, and setup suggestions. */
export function CustomerPage() {
  const { carId = '' } = useParams();
  const { data: car, isPending, isError, error } = useCar(carId);
  if (!car && carIsHidden(error)) return <CarNotFound forShop />;
  return (
    <div className="flex flex-col gap-6">
      <title>{`${car?.name ?? 'Customer'} · Scrubline`}</title>
      <CarHeader
        car={car}
        isPending={isPending}
        isError={isError}
        back={{ to: paths.shop, label: 'Shop' }}
        about={(c) => (
          <>
            {c.owner.displayName}’s car
            {c.coDrivers.length ? `, also driven by ${c.coDrivers.map((p) => p.displayName).join(', ')}` : ''}. Read only: the drivers
            record runs, setups, tyres and changes; you comment and suggest.
          </>
        )}
        errorText="This car could not be loaded. Its owner may have taken your shop’s access away."
      >
        <Link to={recordPath.review(carId)} className={buttonClasses('secondary')}>
          <ChartScatter aria-hidden="true" className="size-5" /> Season review
        </Link>
      </CarHeader>
      <div className="grid grid-cols-1 gap-4 lg:grid-cols-2">
        <div className="flex flex-col gap-4">
          <CardSection title="Open a work order">
            <OpenWorkOrderForm carId={carId} />
          </CardSection>
          <CardSection title="Visits">
            <CarVisits carId={carId} />
          </CardSection>
          <CardSection title="Suggestions">
            <SuggestionList carId={carId} emptyText="No suggestions yet. Use “Suggest a change” on a setup snapshot." />
          </CardSection>
          <CardSection title="Tyres">
            <Tyres carId={carId} />
          </CardSection>
          <CardSection title="Change log">
            <Changes carId={carId} />
          </CardSection>
          <CardSection title="Events">
            <Events carId={carId} />
          </CardSection>
        </div>
        <CardSection title="Setup history">
          <Setups carId={carId} />
        </CardSection>
      </div>
    </div>
  );
}
