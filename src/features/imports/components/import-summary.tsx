import type { ImportFailure, ImportResult } from '@shared/import/import.schema';
import { runResult } from '@/features/runs/utils/run-words';

const runs = (n: number) => `${n} ${n === 1 ? 'run' : 'runs'}`;

/**
 * What the import did: runs added, runs already logged (left as they were, and those the sheet gives otherwise named
 * with both results, since the club's sheet may be the one that is right), and runs left out with why.
 */
export function ImportSummary({ result, notSent }: { result: ImportResult; notSent: readonly ImportFailure[] }) {
  const failed = [...notSent, ...result.failed].sort((a, b) => a.line - b.line || a.runNumber - b.runNumber);
  return (
    <div role="status" aria-label="Import result" className="flex flex-col gap-2">
      <p className="text-lg font-bold">Added {runs(result.created)}.</p>
      {result.alreadyThere > 0 ? (
        <p>{runs(result.alreadyThere)} already logged for this event; kept as they were.</p>
      ) : null}
      {result.differing.length > 0 ? (
        <div>
          <p className="font-semibold text-warning">
            The sheet gives {result.differing.length === 1 ? 'one of them' : `${result.differing.length} of them`} otherwise. If the sheet is
            right, edit {result.differing.length === 1 ? 'the run' : 'those runs'} on the event’s page:
          </p>
          <ul className="list-disc pl-5">
            {result.differing.map((d) => (
              <li key={d.runNumber} className="tabular-figures">
                Run {d.runNumber}: logged {runResult(d.logged)}; the sheet (line {d.line}) {runResult(d.sheet)}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      {failed.length > 0 ? (
        <div>
          <p className="font-semibold text-warning">Not imported ({failed.length}):</p>
          <ul className="list-disc pl-5">
            {failed.map((f, i) => (
              <li key={`${f.line}-${f.runNumber}-${i}`}>
                Line {f.line}
                {f.runNumber > 0 ? `, run ${f.runNumber}` : ''}: {f.reason}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
    </div>
  );
}
