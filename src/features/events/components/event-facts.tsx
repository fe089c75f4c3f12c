import type { SeasonEvent } from '@shared/season/event.schema';
import { formatLongDay } from '@/lib/dates';

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
