import { useId } from 'react';
import { SideScroll } from '@/components/side-scroll/side-scroll';

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

/**
 * The scatter plot's points as a table: for screen readers, and for reading exact values. On a phone it scrolls
 * sideways in its own box; the event and setup wrap within a width of their own and every value stays on one line.
 */
export function PointsTable({ id, caption, xHeading, yHeading, withCorner, rows }: PointsTableProps) {
  const captionId = useId();
  const nowrap = 'py-1 pr-3 whitespace-nowrap';
  return (
    <div className="flex flex-col gap-1">
      <p id={captionId} className="text-sm font-semibold">
        {caption}
      </p>
      <SideScroll id={id} label={caption} more="the setup and the plotted values">
        <table aria-labelledby={captionId} className="tabular-figures w-full text-left text-sm">
          <thead>
            <tr className="border-b border-line-strong align-bottom">
              <th scope="col" className={nowrap}>Marker</th>
              <th scope="col" className={nowrap}>Event</th>
              <th scope="col" className={nowrap}>Runs</th>
              <th scope="col" className={nowrap}>Setup</th>
              {withCorner ? <th scope="col" className={nowrap}>Corner</th> : null}
              <th scope="col" className={nowrap}>{xHeading}</th>
              <th scope="col" className={nowrap}>{yHeading}</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((row) => (
              <tr key={row.key} className="border-b border-line align-top">
                <td className={nowrap}>
                  <span aria-hidden="true" style={row.marker.color ? { color: row.marker.color } : undefined}>
                    {row.marker.glyph}
                  </span>
                  <span className="sr-only">{row.marker.name}</span>
                </td>
                <td className="min-w-44 py-1 pr-3">{row.event}</td>
                <td className={nowrap}>{row.runs}</td>
                <td className="min-w-32 py-1 pr-3">{row.setup}</td>
                {withCorner ? <td className={nowrap}>{row.corner ?? '—'}</td> : null}
                <td className={nowrap}>{row.x}</td>
                <td className={nowrap}>{row.y}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </SideScroll>
    </div>
  );
}
