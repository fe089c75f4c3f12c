import { useId } from 'react';
import type { SeasonResult } from '@shared/analysis/analysis.schema';
import { formatRunTime } from '@shared/season/run-time';
import { SideScroll } from '@/components/side-scroll/side-scroll';
import { formatDay } from '@/lib/dates';
import type { DriverSeries } from './season-timeline';

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/** The season timeline as a table: each driver's best adjusted time per event, with runs and cones. */
export function EventsTable({ id, season, drivers }: { id: string; season: SeasonResult; drivers: DriverSeries[] }) {
  const captionId = useId();
  const events = [...season.events].sort((a, b) => a.date.localeCompare(b.date));
  const caption = 'Best adjusted time per event (courses differ between events)';
  return (
    <div className="flex flex-col gap-1">
      <p id={captionId} className="text-sm font-semibold">
        {caption}
      </p>
      <SideScroll id={id} label={caption} more={drivers.length > 1 ? "every driver's times" : 'the times'}>
        <table aria-labelledby={captionId} className="tabular-figures w-full text-left text-sm">
          <thead>
            <tr className="border-b border-line-strong align-bottom">
              <th scope="col" className="py-1 pr-3 whitespace-nowrap">Date</th>
              <th scope="col" className="py-1 pr-3">Event</th>
              {drivers.map((d) => (
                <th key={d.id} scope="col" className="py-1 pr-3 whitespace-nowrap">
                  <span aria-hidden="true" style={d.style.color ? { color: d.style.color } : undefined}>
                    {d.style.glyph}{' '}
                  </span>
                  {d.name}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {events.map((e) => (
              <tr key={e.eventId} className="border-b border-line align-top">
                <td className="py-1 pr-3 whitespace-nowrap">{formatDay(e.date)}</td>
                <th scope="row" className="min-w-44 py-1 pr-3 font-normal">
                  {e.name}
                  {e.venue ? <span className="text-ink-muted"> · {e.venue}</span> : null}
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
              </tr>
            ))}
          </tbody>
        </table>
      </SideScroll>
    </div>
  );
}
