import { useId } from 'react';
import { TableBox } from './show-table-toggle';

/** One plotted point as the table writes it: every value already in words and the user's units. */
export interface PointRow {
  key: number;
  /** The event's marker: its glyph, colour (null for the theme's ink) and shape's name for screen readers. */
  marker: { glyph: string; color: string | null; name: string };
  event: string;
  runs: string;
  setup: string;
  /** Only for wear, which is measured per corner. */
  corner?: string;
  /** A timed run: who drove it and its number at the event, as the event's page lists them. */
  driver?: string;
  runNumber?: number;
  x: string;
  y: string;
}

interface PointsTableProps {
  id: string;
  caption: string;
  /** Column headings of the two plotted values, with their units. */
  xHeading: string;
  yHeading: string;
  withCorner: boolean;
  rows: readonly PointRow[];
}

interface EventGroup {
  event: string;
  marker: PointRow['marker'];
  rows: PointRow[];
}

/** The rows under their event, in the chart's order (which already keeps an event's points together). */
function byEvent(rows: readonly PointRow[]): EventGroup[] {
  const groups: EventGroup[] = [];
  for (const row of rows) {
    const last = groups.at(-1);
    if (last && last.event === row.event) last.rows.push(row);
    else groups.push({ event: row.event, marker: row.marker, rows: [row] });
  }
  return groups;
}

/** True when a column would say the same thing on every row: it is then said once, above the table. */
function sameOnEvery(rows: readonly PointRow[], value: (row: PointRow) => string | undefined): boolean {
  return rows.length > 1 && rows.every((row) => value(row) === value(rows[0]!));
}

const cell = 'py-1 pr-3 whitespace-nowrap';

/**
 * The scatter plot's points as a table: for screen readers, and for reading exact values. Each event heads its
 * own group of rows; a row starts with what tells it apart (driver and run number, the corner, or its place in the
 * event) and then the two plotted values, so on a phone the numbers are in view and only the setup is a swipe away.
 * A column that would say the same on every row (one run per point, a single driver) is said once above instead.
 */
export function PointsTable({ id, caption, xHeading, yHeading, withCorner, rows }: PointsTableProps) {
  const captionId = useId();
  const noteId = useId();
  const groups = byEvent(rows);

  const hasDriver = rows.some((r) => r.driver !== undefined);
  const hasRunNumber = rows.some((r) => r.runNumber !== undefined);
  const fold = {
    driver: hasDriver && sameOnEvery(rows, (r) => r.driver),
    corner: withCorner && sameOnEvery(rows, (r) => r.corner),
    runs: sameOnEvery(rows, (r) => r.runs),
    setup: sameOnEvery(rows, (r) => r.setup),
  };
  const show = {
    driver: hasDriver && !fold.driver,
    corner: withCorner && !fold.corner,
    runs: !fold.runs,
    setup: !fold.setup,
  };
  const first = rows[0];
  const said = first
    ? [
        fold.runs ? first.runs : null,
        fold.driver ? `driver ${first.driver ?? '—'}` : null,
        fold.corner ? `corner ${first.corner ?? '—'}` : null,
        fold.setup ? `setup ${first.setup}` : null,
      ].filter((part): part is string => part !== null)
    : [];

  const capital = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);
  // What tells the rows apart, in the order the cells write it; without any, a row's place in its event.
  const idHeading = capital([show.driver ? 'driver' : null, hasRunNumber ? 'run' : null, show.corner ? 'corner' : null].filter(Boolean).join(', ')) || 'Point';
  const identify = (row: PointRow, place: number) => {
    const parts = [
      show.driver ? (row.driver ?? '—') : null,
      hasRunNumber ? (row.runNumber !== undefined ? `run ${row.runNumber}` : 'run —') : null,
      show.corner ? (row.corner ?? '—') : null,
    ].filter((part): part is string => part !== null);
    return capital(parts.join(' · ')) || String(place);
  };

  const further = [show.setup ? 'the setup' : null, show.runs ? 'the runs between readings' : null].filter(Boolean);
  const columns = 3 + Number(show.setup) + Number(show.runs);

  return (
    <div className="flex flex-col gap-1">
      <p id={captionId} className="text-sm font-semibold">
        {caption}
      </p>
      {said.length > 0 ? (
        <p id={noteId} className="text-xs text-ink-muted">
          Every row: {said.join(' · ')}.
        </p>
      ) : null}
      <TableBox id={id} label={caption} more={further.length ? further.join(' and ') : 'the rest'}>
        <table
          aria-labelledby={captionId}
          aria-describedby={said.length > 0 ? noteId : undefined}
          className="tabular-figures w-full text-left text-sm"
        >
          <thead>
            <tr className="border-b border-line-strong align-bottom">
              <th scope="col" className={cell}>
                {idHeading}
              </th>
              <th scope="col" className="min-w-20 py-1 pr-3">
                {xHeading}
              </th>
              <th scope="col" className="min-w-20 py-1 pr-3">
                {yHeading}
              </th>
              {show.setup ? <th scope="col" className={cell}>Setup</th> : null}
              {show.runs ? <th scope="col" className={cell}>Runs</th> : null}
            </tr>
          </thead>
          {groups.map((group, g) => (
            <tbody key={`${g}-${group.event}`}>
              <tr className="border-b border-line bg-surface-raised">
                <th scope="rowgroup" colSpan={columns} className="py-1 pr-3 pl-1 text-left font-semibold">
                  {/* Kept in view and within the box's width while the rows below scroll sideways. */}
                  <span className="sticky left-1 block max-w-[calc(100cqw-0.5rem)]">
                    <span aria-hidden="true" style={group.marker.color ? { color: group.marker.color } : undefined}>
                      {group.marker.glyph}
                    </span>
                    <span className="sr-only">{group.marker.name}</span> {group.event}
                  </span>
                </th>
              </tr>
              {group.rows.map((row, i) => (
                <tr key={row.key} className="border-b border-line align-top">
                  <th scope="row" className={`${cell} font-normal`}>
                    {identify(row, i + 1)}
                  </th>
                  <td className={cell}>{row.x}</td>
                  <td className={cell}>{row.y}</td>
                  {show.setup ? <td className="min-w-32 py-1 pr-3">{row.setup}</td> : null}
                  {show.runs ? <td className={cell}>{row.runs}</td> : null}
                </tr>
              ))}
            </tbody>
          ))}
        </table>
      </TableBox>
    </div>
  );
}
