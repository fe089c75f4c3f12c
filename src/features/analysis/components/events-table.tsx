import { useId } from 'react';
import type { SeasonResult } from '@shared/analysis/analysis.schema';
import { formatRunTime } from '@shared/season/run-time';
import { formatDay } from '@/lib/dates';
import type { DriverSeries } from './season-timeline';
import { TableBox } from './show-table-toggle';

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/**
 * The season timeline as a table: each driver's best adjusted time per event, with runs and cones. A row starts
 * with the event's date (the chart's x) and then the times, so on a phone the numbers are in view; the event's
 * name and place come last.
 */
export function EventsTable({ id, season, drivers }: { id: string; season: SeasonResult; drivers: DriverSeries[] }) {
  const captionId = useId();
  const events = [...season.events].sort((a, b) => a.date.localeCompare(b.date));
  const caption = 'Best adjusted time per event (courses differ between events)';
  return (
    <div className="flex flex-col gap-1">
      <p id={captionId} className="text-sm font-semibold">
        {caption}
      </p>
      <TableBox id={id} label={caption} more={drivers.length > 2 ? "every driver's times and the events' names" : "the events' names"}>
        <table aria-labelledby={captionId} className="tabular-figures w-full text-left text-sm">
          <thead>
            <tr className="border-b border-line-strong align-bottom">
              <th scope="col" className="py-1 pr-3 whitespace-nowrap">Date</th>
              {drivers.map((d) => (
                <th key={d.id} scope="col" className="py-1 pr-3 whitespace-nowrap">
                  <span aria-hidden="true" style={d.style.color ? { color: d.style.color } : undefined}>
                    {d.style.glyph}{' '}
                  </span>
                  {d.name}
                </th>
              ))}
              <th scope="col" className="py-1 pr-3">Event</th>
            </tr>
          </thead>
          <tbody>
            {events.map((e) => (
              <tr key={e.eventId} className="border-b border-line align-top">
                <th scope="row" className="py-1 pr-3 text-left font-normal whitespace-nowrap">
                  {formatDay(e.date)}
                </th>
                {drivers.map((d) => {
                  const entry = e.drivers.find((x) => x.driver.id === d.id);
                  return (
                    <td key={d.id} className="py-1 pr-3 whitespace-nowrap">
                      <span className="block">{entry?.bestAdjustedSec != null ? `${formatRunTime(entry.bestAdjustedSec)} s` : '—'}</span>
                      {entry ? (
                        <span className="block text-xs text-ink-muted">
                          {plural(entry.runCount, 'run', 'runs')}, {plural(entry.cones, 'cone', 'cones')}
                        </span>
                      ) : null}
                    </td>
                  );
                })}
                <td className="min-w-44 py-1 pr-3">
                  {e.name}
                  {e.venue ? <span className="text-ink-muted"> · {e.venue}</span> : null}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </TableBox>
    </div>
  );
}
