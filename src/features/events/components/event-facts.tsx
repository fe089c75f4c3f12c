import type { SeasonEvent } from '@shared/season/event.schema';
import { formatQuantity } from '@shared/calc/units.calc';
import { formatLongDay } from '@/lib/dates';
import { useUnits } from '@/lib/units-context';

const KIND_WORDS: Record<SeasonEvent['kind'], string> = { autocross: 'Autocross', track_day: 'Track day' };

/** Each dot holds on to the words before it (a no-break space), so a wrapped line never starts with one. */
const DOT = '\u00a0· ';

/** One line about an event: day, venue, kind, cone penalty. */
export function EventFacts({ event }: { event: SeasonEvent }) {
  return (
    <p className="tabular-figures text-sm text-ink-muted">
      {formatLongDay(event.date)}
      {event.venue ? DOT + event.venue : ''}
      {DOT + KIND_WORDS[event.kind]}
      {/* A no-break space between the number and its unit keeps "2 s" on one line. */}
      {event.kind === 'autocross' ? `${DOT}${event.conePenaltySec}\u00a0s\u00a0a\u00a0cone` : ''}
    </p>
  );
}

/** The conditions written down for the day, in the user's units: surface, air and track temperature; nothing if none. */
export function EventConditions({ event }: { event: SeasonEvent }) {
  const units = useUnits();
  const parts = [
    event.surface,
    event.airTempC !== null ? `air ${formatQuantity(event.airTempC, 'temperature', units)}` : null,
    event.trackTempC !== null ? `track ${formatQuantity(event.trackTempC, 'temperature', units)}` : null,
  ].filter(Boolean);
  return parts.length ? <p className="tabular-figures text-sm text-ink-muted">{parts.join(DOT)}</p> : null;
}
