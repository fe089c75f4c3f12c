import { useState, type FormEvent } from 'react';
import { setFactorInputSchema, type ClassFactor, type SetFactorInput } from '@shared/collab/team.schema';
import * as z from '@shared/zod';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { isApiError } from '@/lib/api-client';
import { parseDecimal, typeANumber } from '@/lib/numbers';
import { useFactors } from '../api/get-factors';
import { FactorSaveError, useSetFactors } from '../api/set-factor';
import { failureMessage } from '../utils/online-failure';
import { formatFactor } from '../utils/board-format';
import { SeasonPicker } from './season-picker';

/** A factor as shown: three decimals, or four when it has them. */
const factorText = (factor: number | undefined) => (factor === undefined ? '' : formatFactor(factor));

/** The rows: every class a car is entered in, and every class that already has a factor this season. */
function classRows(entryClasses: readonly string[], factors: readonly ClassFactor[]): string[] {
  return [...new Set([...entryClasses, ...factors.map((f) => f.classCode)])].sort((a, b) => a.localeCompare(b));
}

type Drafts = Record<string, string>;

/** What changed, checked with the shared rules; a row left empty removes its factor. */
function changedRows(
  season: number,
  rows: readonly string[],
  drafts: Drafts,
  saved: ReadonlyMap<string, number>,
): { changes: SetFactorInput[]; errors: Record<string, string> } {
  const changes: SetFactorInput[] = [];
  const errors: Record<string, string> = {};
  for (const classCode of rows) {
    const text = drafts[classCode] ?? factorText(saved.get(classCode));
    const parsed = parseDecimal(text);
    if (parsed.kind === 'invalid') {
      errors[classCode] = typeANumber('0.853');
      continue;
    }
    // Sent as typed: a fifth decimal is refused beside the field by the shared rules, never rounded away.
    const factor = parsed.kind === 'empty' ? null : parsed.value;
    const before = saved.get(classCode) ?? null;
    if (factor === before) continue;
    const checked = z.safeParse(setFactorInputSchema, { season, classCode, factor });
    if (!checked.success) {
      errors[classCode] = checked.error.issues.map((i) => i.message).join(' ');
      continue;
    }
    changes.push(checked.data);
  }
  return { changes, errors };
}

function FactorsTable({ teamId, season, entryClasses }: { teamId: string; season: number; entryClasses: readonly string[] }) {
  const { data, isPending, isError } = useFactors(teamId, season);
  const save = useSetFactors(teamId);
  const [drafts, setDrafts] = useState<Drafts>({});
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [message, setMessage] = useState<string | null>(null);

  if (isPending) return <p className="text-ink-muted">Loading the factors for {season}…</p>;
  if (isError && !data) return <p className="text-ink-muted">The factors could not be loaded. Try again shortly.</p>;

  const saved = new Map(data.items.filter((f) => f.season === season).map((f) => [f.classCode, f.factor]));
  const rows = classRows(entryClasses, data.items.filter((f) => f.season === season));
  if (rows.length === 0) return <p className="text-ink-muted">No cars are entered yet; each class gets a row here once one is.</p>;

  const onSubmit = (event: FormEvent) => {
    event.preventDefault();
    setFormError(null);
    setMessage(null);
    const { changes, errors: found } = changedRows(season, rows, drafts, saved);
    setErrors(found);
    if (Object.keys(found).length > 0) return;
    if (changes.length === 0) {
      setMessage('Nothing changed.');
      return;
    }
    save.mutate(changes, {
      onSuccess: () => {
        setDrafts({});
        setMessage(`Factors for ${season} saved. The class board uses them now.`);
      },
      onError: (error) => {
        const cause = error instanceof FactorSaveError ? error.cause : error;
        if (error instanceof FactorSaveError && isApiError(cause) && cause.hasFieldErrors) {
          setErrors({ [error.classCode]: Object.values(cause.fieldErrors).flat().join(' ') });
          return;
        }
        setFormError(failureMessage(cause));
      },
    });
  };

  return (
    <form onSubmit={onSubmit} noValidate aria-label={`Class factors for ${season}`} className="flex flex-col gap-3">
      <table className="w-full border-collapse text-left">
        <caption className="sr-only">Index factor per class, {season}</caption>
        <thead>
          <tr className="border-b border-line text-sm text-ink-muted">
            <th scope="col" className="py-2 pr-3 font-semibold">
              Class
            </th>
            <th scope="col" className="py-2 font-semibold">
              Factor
            </th>
          </tr>
        </thead>
        <tbody>
          {rows.map((classCode) => {
            const errorId = `factor-${classCode}-error`;
            return (
              <tr key={classCode} className="border-b border-line align-top">
                <th scope="row" className="py-2 pr-3 font-bold">
                  {classCode}
                </th>
                <td className="py-2">
                  <input
                    type="text"
                    inputMode="decimal"
                    autoComplete="off"
                    spellCheck={false}
                    aria-label={`Factor for class ${classCode}`}
                    aria-invalid={errors[classCode] ? true : undefined}
                    aria-describedby={errors[classCode] ? errorId : undefined}
                    placeholder="none"
                    className="tabular-figures min-h-tap w-32 rounded border border-line-strong bg-surface px-3 text-right text-base text-ink placeholder:text-ink-muted aria-[invalid=true]:border-2 aria-[invalid=true]:border-warning"
                    value={drafts[classCode] ?? factorText(saved.get(classCode))}
                    onChange={(e) => {
                      const value = e.target.value;
                      setDrafts((d) => ({ ...d, [classCode]: value }));
                      setMessage(null);
                    }}
                    onBlur={(e) => {
                      const parsed = parseDecimal(e.target.value);
                      // Tidied to the shown form, which pads to three decimals but never drops a digit typed.
                      if (parsed.kind === 'number') setDrafts((d) => ({ ...d, [classCode]: formatFactor(parsed.value) }));
                    }}
                  />
                  {errors[classCode] ? (
                    <p id={errorId} className="pt-1 text-sm font-semibold text-warning">
                      {errors[classCode]}
                    </p>
                  ) : null}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      <FormAlert message={formError} />
      <p role="status" className="text-sm font-semibold text-success">
        {message}
      </p>
      <div>
        <Button type="submit" isPending={save.isPending} pendingLabel="Saving…">
          Save factors
        </Button>
      </div>
    </form>
  );
}

/**
 * Captains: the index factor of each class on the board, per season. The index time is the
 * adjusted time multiplied by it, so cars of different classes can be compared.
 */
export function FactorsEditor({ teamId, entryClasses, initialSeason }: { teamId: string; entryClasses: readonly string[]; initialSeason: number }) {
  const [season, setSeason] = useState(initialSeason);
  return (
    <div className="flex flex-col gap-4">
      <p className="text-ink-muted">
        Enter your own class factors here: Scrubline ships with none. Use the figures your club or series publishes for the season. Each
        factor multiplies a car’s adjusted time into its index time; it keeps up to four decimals (for example 0.853 or 0.8535). Leave a row empty to remove its
        factor; that class then shows no index times.
      </p>
      <SeasonPicker season={season} onChange={setSeason} label="Season for the factors" />
      <FactorsTable key={season} teamId={teamId} season={season} entryClasses={entryClasses} />
    </div>
  );
}
