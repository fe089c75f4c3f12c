import type { Sheet } from '@shared/import/sheet';

export const PREVIEW_ROWS = 8;

/** The column names and the first rows as the file holds them, in a box that scrolls sideways on a phone. */
export function SheetPreview({ sheet }: { sheet: Sheet }) {
  const shown = sheet.rows.slice(0, PREVIEW_ROWS);
  const separator = sheet.delimiter === '\t' ? 'tabs' : sheet.delimiter === ';' ? 'semicolons' : 'commas';
  return (
    <div className="flex flex-col gap-2">
      <p className="text-sm text-ink-muted">
        {sheet.rows.length} result {sheet.rows.length === 1 ? 'row' : 'rows'}, fields separated by {separator};{' '}
        {sheet.shape === 'wide' ? 'one row per driver, a column per run.' : 'one row per run.'}
      </p>
      <div className="max-w-full overflow-x-auto rounded border border-line" tabIndex={0} role="region" aria-label="File preview">
        <table className="min-w-full text-sm tabular-nums">
          <caption className="sr-only">
            The first {shown.length} of {sheet.rows.length} rows
          </caption>
          <thead className="bg-surface-raised">
            <tr>
              <th scope="col" className="px-2 py-1 text-left font-semibold text-ink-muted">
                Line
              </th>
              {sheet.header.map((h, i) => (
                <th key={i} scope="col" className="whitespace-nowrap px-2 py-1 text-left font-semibold">
                  {h || `Column ${i + 1}`}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {shown.map((row, r) => (
              <tr key={sheet.lines[r]} className="border-t border-line">
                <td className="px-2 py-1 text-ink-muted">{sheet.lines[r]}</td>
                {row.map((cell, c) => (
                  <td key={c} className="whitespace-nowrap px-2 py-1">
                    {cell}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {sheet.skipped.length > 0 ? (
        <details className="text-sm">
          <summary className="min-h-tap cursor-pointer content-center">
            {sheet.skipped.length} {sheet.skipped.length === 1 ? 'line' : 'lines'} set aside (not results)
          </summary>
          <ul className="list-disc pl-5">
            {sheet.skipped.map((s) => (
              <li key={s.line}>
                Line {s.line}: {s.reason}
              </li>
            ))}
          </ul>
        </details>
      ) : null}
    </div>
  );
}
