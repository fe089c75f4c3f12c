import { formatDistance } from 'date-fns';
import { formatDateTime, parseIsoDate } from './dates';

/*
 * "5 minutes ago" for threads and lists read calmly at home. date-fns lives here, not in dates.ts,
 * so only the screens that show relative times download it (never the trackside page itself).
 */

/** How long ago a moment was, in words: "about 2 hours ago", "3 days ago". */
export function formatRelative(iso: string, now: Date = new Date()): string {
  const date = parseIsoDate(iso);
  if (Number.isNaN(date.getTime())) return '';
  // A server clock a little ahead of this phone's must not read "in a few seconds".
  if (date.getTime() > now.getTime()) return 'just now';
  return formatDistance(date, now, { addSuffix: true });
}

/** A relative time, with the exact moment for machines and as a tooltip. */
export function RelativeTime({ iso, className }: { iso: string; className?: string }) {
  return (
    <time dateTime={iso} title={formatDateTime(iso)} className={className}>
      {formatRelative(iso)}
    </time>
  );
}
