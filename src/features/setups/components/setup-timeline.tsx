import { useEffect, useId, useState, type ReactNode } from 'react';
import { Link, useLocation } from 'react-router-dom';
import { ChevronDown, ChevronRight, Lightbulb, Wrench } from 'lucide-react';
import type { Car } from '@shared/season/car.schema';
import { diffSetups } from '@shared/season/setup-diff';
import { pathTo } from '@/config/paths';
import { recordPath } from '@/config/record-paths';
import { buttonClasses } from '@/components/ui/button';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { PendingBadge } from '@/components/ui/pending-badge';
import { formatDateTime, formatDay } from '@/lib/dates';
import { useOutbox } from '@/lib/outbox-context';
import { refusalWords } from '@/features/sync/utils/refusal-words';
import type { SetupView } from '../utils/setup-views';
import { SetupChangeList } from './setup-change-list';
import { SetupValues } from './setup-values';

function PendingProblem({ setup, carId }: { setup: SetupView; carId: string }) {
  const outbox = useOutbox();
  const pending = setup.pending;
  if (!pending || pending.state !== 'failed') return null;
  return (
    <div role="alert" className="flex flex-col gap-2 rounded border border-warning-line bg-warning-surface p-3 text-sm">
      <p className="font-semibold text-warning">
        Refused: {refusalWords(pending.error, 'the server did not accept it')}
      </p>
      <div className="flex flex-wrap gap-2">
        {pending.kind === 'setup.create' ? (
          <Link to={recordPath.fixSetup(carId, pending.entryKey)} className={buttonClasses('secondary')}>
            Fix it
          </Link>
        ) : (
          <Button variant="secondary" onClick={() => void outbox.retry(pending.entryKey)}>
            Try again
          </Button>
        )}
        <Button variant="quiet" onClick={() => void outbox.discard(pending.entryKey)}>
          Discard
        </Button>
      </div>
    </div>
  );
}

/** Where a snapshot came from, when a shop made it: its suggestion or its work order, linked. */
function OriginBadge({ setup }: { setup: SetupView }) {
  const origin = setup.suggestion
    ? { to: recordPath.suggestion(setup.suggestion.id), Icon: Lightbulb, text: `from ${setup.suggestion.shopName}: ${setup.suggestion.title}` }
    : setup.workOrder
      ? { to: recordPath.workOrder(setup.workOrder.id), Icon: Wrench, text: `handed back by ${setup.workOrder.shopName} after the visit of ${formatDay(setup.workOrder.visitDate)}` }
      : null;
  if (!origin) return null;
  return (
    <Link
      to={origin.to}
      className="inline-flex min-h-tap items-center gap-1 self-start rounded bg-accent-soft px-2 text-sm font-semibold text-link"
    >
      <origin.Icon aria-hidden="true" className="size-4 shrink-0" />
      <span className="wrap-anywhere">{origin.text}</span>
    </Link>
  );
}

/**
 * How many snapshots show in full before the rest fold away. A season of quick changes runs to a dozen or more;
 * the newest few are the ones compared at the car, and each older one is a tap away.
 */
export const SNAPSHOTS_SHOWN = 3;

/** The snapshot a link such as /cars/…#setup-<id> names, if any. */
function useSnapshotInAddress(): string | null {
  const { hash } = useLocation();
  return hash.startsWith('#setup-') ? decodeURIComponent(hash.slice('#setup-'.length)) : null;
}

/**
 * A link such as /cars/…#setup-<id> lands on one snapshot. The list arrives after the page has
 * drawn, so the browser's own jump to the anchor has nothing to find; do it once the item exists.
 */
function useScrollToSnapshot(id: string | null, shown: number) {
  useEffect(() => {
    if (!id) return;
    const target = document.getElementById(`setup-${id}`);
    if (!target) return;
    target.scrollIntoView({ block: 'start' });
    target.focus({ preventScroll: true });
  }, [id, shown]);
}

/**
 * How many of the snapshots to draw: the newest few, every one still on this phone (a refused one needs its
 * driver), and down to the one the page was opened for.
 */
function foldedFrom(setups: readonly SetupView[], opened: readonly (string | null)[]): number {
  let shown = Math.max(SNAPSHOTS_SHOWN, setups.findLastIndex((s) => s.pending) + 1);
  for (const id of opened) {
    const at = id ? setups.findIndex((s) => s.id === id) : -1;
    if (at >= 0) shown = Math.max(shown, at + 1);
  }
  return Math.min(shown, setups.length);
}

interface SetupTimelineProps {
  carId: string;
  setups: readonly SetupView[];
  /** For readers who cannot record setups (a shop): no "start a new setup" link. */
  readOnly?: boolean;
  /** More under each snapshot: its comments, a shop's "Suggest a change". */
  renderExtras?: (setup: SetupView) => ReactNode;
  /** The snapshot the page was opened for (a notification's link): drawn even when it is an old one. */
  revealedId?: string | null;
  /** The car's damper adjusters, so a change of clicks says stiffer or softer. */
  adjusters?: Car['damperAdjusters'] | undefined;
}

interface SnapshotItemProps extends Pick<SetupTimelineProps, 'carId' | 'readOnly' | 'renderExtras' | 'adjusters'> {
  setup: SetupView;
  /** The snapshot before it, whose values its changes are read against. */
  before: SetupView | undefined;
}

/** One snapshot of the history: when and by whom, what changed from the one before, its values and links. */
function SnapshotItem({ carId, setup, before, readOnly, renderExtras, adjusters }: SnapshotItemProps) {
  return (
    // The id lets a link land on one snapshot (the suggestion page's "Open the new setup").
    <li
      id={`setup-${setup.id}`}
      tabIndex={-1}
      className="flex scroll-mt-4 flex-col gap-2 rounded border border-line p-3 focus:ring-2 focus:ring-accent focus:outline-none"
    >
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 className="font-bold wrap-anywhere">{setup.label}</h3>
        {setup.pending ? <PendingBadge state={setup.pending.state} /> : null}
      </div>
      <p className="tabular-figures text-sm text-ink-muted">
        From {formatDateTime(setup.effectiveFrom)} · by {setup.createdBy.displayName || 'someone'}
      </p>
      <OriginBadge setup={setup} />
      {before ? (
        <div className="flex flex-col gap-1">
          <p className="text-sm text-ink-muted">Changes from “{before.label}”:</p>
          <SetupChangeList changes={diffSetups(before, setup)} adjusters={adjusters} />
        </div>
      ) : (
        <p className="text-sm text-ink-muted">The first snapshot on record.</p>
      )}
      {setup.notes ? <p className="text-sm">{setup.notes}</p> : null}
      <PendingProblem setup={setup} carId={carId} />
      <details className="group">
        {/* A chevron like the other fold-outs' (Comments, Photos and files), turned down while open. */}
        <summary className="inline-flex min-h-tap cursor-pointer items-center gap-1 font-semibold text-link">
          <ChevronRight aria-hidden="true" className="size-4 group-open:rotate-90" />
          All values
        </summary>
        <div className="pt-2">
          <SetupValues setup={setup} />
        </div>
      </details>
      {readOnly && setup.pending ? null : (
        <div className="flex flex-wrap gap-x-4">
          {readOnly ? null : (
            <Link to={pathTo.newSetup(carId, setup.id)} className="inline-flex min-h-tap items-center font-semibold text-link underline">
              Start a new setup from this one
            </Link>
          )}
          {/* Season export: a snapshot still on this phone is not on the server to print yet. */}
          {setup.pending ? null : (
            <Link to={recordPath.setupSheet(setup.id)} className="inline-flex min-h-tap items-center font-semibold text-link underline">
              Print a setup sheet
            </Link>
          )}
        </div>
      )}
      {renderExtras?.(setup)}
    </li>
  );
}

/** A car's setup history, newest first: each snapshot with what changed from the one before it. */
export function SetupTimeline({ carId, setups, readOnly = false, renderExtras, revealedId = null, adjusters }: SetupTimelineProps) {
  const anchored = useSnapshotInAddress();
  const listId = useId();
  // Unfolding moves the reader to the first snapshot it brought out; the button they pressed is gone.
  const [unfoldedAt, setUnfoldedAt] = useState<string | null>(null);
  const shown = unfoldedAt ? setups.length : foldedFrom(setups, [anchored, revealedId]);
  useScrollToSnapshot(anchored, shown);
  useEffect(() => {
    if (unfoldedAt) document.getElementById(`setup-${unfoldedAt}`)?.focus();
  }, [unfoldedAt]);
  if (setups.length === 0) {
    return <EmptyState message="No setup recorded yet. Record the car as it is now to compare later changes against it." />;
  }
  const firstFolded = setups[shown];
  const oldest = setups[setups.length - 1]!;
  const folded = setups.length - shown;
  return (
    <div className="flex flex-col gap-3">
      <ol className="flex flex-col gap-3" aria-label="Setup history, newest first">
        {setups.slice(0, shown).map((setup, i) => (
          <SnapshotItem
            key={setup.id}
            carId={carId}
            setup={setup}
            before={setups[i + 1]}
            readOnly={readOnly}
            renderExtras={renderExtras}
            adjusters={adjusters}
          />
        ))}
      </ol>
      {firstFolded ? (
        <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
          <Button variant="secondary" aria-describedby={`${listId}-oldest`} onClick={() => setUnfoldedAt(firstFolded.id)}>
            <ChevronDown aria-hidden="true" className="size-5" />
            {`Show ${folded} older ${folded === 1 ? 'setup' : 'setups'}`}
          </Button>
          <span id={`${listId}-oldest`} className="tabular-figures text-sm text-ink-muted">
            back to {formatDay(oldest.effectiveFrom)}
          </span>
        </div>
      ) : null}
    </div>
  );
}
