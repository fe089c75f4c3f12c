import { useId, useState, type ReactNode } from 'react';
import { ChevronDown, ChevronRight, History } from 'lucide-react';
import type { TreadReading } from '@shared/season/tyre.schema';
import { formatDateTime } from '@/lib/dates';
import { useTreadReadings } from '../api/get-tread-readings';
import { earlierReadings } from '../utils/tread';
import { TreadDisplay } from './tread-display';

interface ReadingHistoryProps {
  tyreSetId: string;
  setLabel: string;
  /** The reading already shown above the history, left out of it. */
  latestReadingId: string;
  /** What the page adds under each earlier reading (its photos). */
  renderReadingExtras?: (reading: TreadReading) => ReactNode;
}

/**
 * A set's earlier tread readings, newest first, each in the corner grid, so the wear over the season can be
 * followed. Folded under a button so the page stays short on a phone; the readings are asked for on first open.
 */
export function ReadingHistory({ tyreSetId, setLabel, latestReadingId, renderReadingExtras }: ReadingHistoryProps) {
  const [open, setOpen] = useState(false);
  const panelId = useId();
  const Chevron = open ? ChevronDown : ChevronRight;
  return (
    <div className="flex flex-col gap-2">
      <button
        type="button"
        aria-expanded={open}
        aria-controls={panelId}
        onClick={() => setOpen((v) => !v)}
        className="inline-flex min-h-12 items-center gap-1 self-start font-semibold text-link"
      >
        <Chevron aria-hidden="true" className="size-4" />
        <History aria-hidden="true" className="size-4" />
        Earlier readings<span className="sr-only"> of {setLabel}</span>
      </button>
      <div id={panelId} hidden={!open}>
        {open ? (
          <EarlierReadings tyreSetId={tyreSetId} setLabel={setLabel} latestReadingId={latestReadingId} renderReadingExtras={renderReadingExtras} />
        ) : null}
      </div>
    </div>
  );
}

function EarlierReadings({ tyreSetId, setLabel, latestReadingId, renderReadingExtras }: ReadingHistoryProps) {
  const query = useTreadReadings(tyreSetId, { enabled: true });
  if (!query.data) {
    return (
      <p className="text-ink-muted">
        {query.isError ? 'Earlier readings could not be loaded. Try again when you have signal.' : 'Loading earlier readings…'}
      </p>
    );
  }
  const readings = earlierReadings(query.data.items, latestReadingId);
  if (readings.length === 0) return <p className="text-ink-muted">No earlier readings: the one above is the first of this set.</p>;
  return (
    <ul className="flex flex-col gap-3" aria-label={`Earlier readings of ${setLabel}`}>
      {readings.map((reading) => (
        <li key={reading.id} className="flex flex-col gap-2 border-t border-line pt-3">
          <p className="tabular-figures text-sm font-semibold">{formatDateTime(reading.takenAt)}</p>
          <TreadDisplay corners={reading.corners} />
          {renderReadingExtras?.(reading)}
        </li>
      ))}
    </ul>
  );
}
