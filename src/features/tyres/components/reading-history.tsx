import type { ReactNode } from 'react';
import { History } from 'lucide-react';
import { FoldOut } from '@/components/fold-out/fold-out';
import type { TreadReading } from '@shared/season/tyre.schema';
import { formatDateTime } from '@/lib/dates';
import { useTreadReadings } from '../api/get-tread-readings';
import { earlierReadings, runsOnSetText } from '../utils/tread';
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
export function ReadingHistory(props: ReadingHistoryProps) {
  return (
    <FoldOut icon={History} label="Earlier readings" what={props.setLabel} joiner="of" loadingText="Loading earlier readings…" failedText="Earlier readings could not be shown.">
      <EarlierReadings {...props} />
    </FoldOut>
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
          <p className="tabular-figures text-sm">
            <span className="font-semibold">{formatDateTime(reading.takenAt)}</span>
            {runsOnSetText(reading) ? <span className="text-ink-muted">, {runsOnSetText(reading)}</span> : null}
          </p>
          <TreadDisplay corners={reading.corners} />
          {renderReadingExtras?.(reading)}
        </li>
      ))}
    </ul>
  );
}
