import { useId, useState, type ChangeEvent } from 'react';
import { Download, Upload } from 'lucide-react';
import { SEASON_FILE_MAX_BYTES, type SeasonImportResult } from '@shared/export/season-file';
import { buttonClasses } from '@/components/ui/button';
import { isApiError } from '@/lib/api-client';
import { seasonFileUrl, useImportSeason } from '../api/import-season';

interface SeasonDataProps {
  carId: string;
  /** After a file became a new car: refresh the lists and open it. */
  onImported: (result: SeasonImportResult) => unknown;
}

/** The file's text (FileReader: what every browser, and the test DOM, can read a picked file with). */
function readText(file: File): Promise<string> {
  return new Promise((resolve, reject) => {
    const reader = new FileReader();
    reader.onload = () => resolve(String(reader.result ?? ''));
    reader.onerror = () => reject(reader.error ?? new Error('The file could not be read'));
    reader.readAsText(file);
  });
}

/** The file's lists, as one record of each is called; a record's place in its list is counted from 1. */
const RECORD_WORDS: Record<string, string> = {
  setups: 'Setup',
  changes: 'Change-log entry',
  events: 'Event',
  runs: 'Run',
  pressures: 'Pressure reading',
  tyreSets: 'Tyre set',
  mountings: 'rotation',
  readings: 'tread reading',
};

/** Field names whose words would read oddly spelled out. */
const FIELD_WORDS: Record<string, string> = { rawTimeSec: 'time (seconds)', eventId: 'event', setupId: 'setup', runId: 'run' };

/** A field's place in the file in words: `runs.3.rawTimeSec` → "Run 4, time (seconds)". */
function placeInFile(path: string): string {
  const parts = path.split('.');
  const words: string[] = [];
  for (let i = 0; i < parts.length; i++) {
    const part = parts[i]!;
    const next = parts[i + 1];
    if (RECORD_WORDS[part] && next !== undefined && /^\d+$/.test(next)) {
      words.push(`${RECORD_WORDS[part]} ${Number(next) + 1}`);
      i++;
    } else {
      words.push(FIELD_WORDS[part] ?? part.replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase());
    }
  }
  const text = words.join(', ');
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/** A refusal in words: the server's message and the first few places it named, each said once. */
function describeError(error: unknown): string {
  if (!isApiError(error)) return 'The file could not be sent. Try again.';
  const named = Object.entries(error.fieldErrors).filter(([, messages]) => messages.join(' ') !== error.message);
  const fields = named.slice(0, 4).map(([path, messages]) => `${placeInFile(path)}: ${messages.join('; ')}`);
  const more = named.length - fields.length;
  return [error.message, ...fields, ...(more > 0 ? [`and ${more} more`] : [])].join(' · ');
}

/**
 * "Your data": the season as a spreadsheet (one row per run with its setup) or as one file with
 * everything, and a file made that way brought in as a new car of your own.
 */
export function SeasonData({ carId, onImported }: SeasonDataProps) {
  const inputId = useId();
  const hintId = useId();
  const [problem, setProblem] = useState<string | null>(null);
  const importing = useImportSeason({ onSuccess: onImported });

  const onFile = async (e: ChangeEvent<HTMLInputElement>) => {
    const input = e.currentTarget;
    const file = input.files?.[0];
    setProblem(null);
    if (!file) return;
    if (file.size > SEASON_FILE_MAX_BYTES) {
      setProblem(`That file is ${(file.size / 1024 / 1024).toFixed(1)} MB; a season file can be at most 5 MB.`);
      input.value = '';
      return;
    }
    let text: string;
    try {
      text = await readText(file);
    } catch {
      setProblem('That file could not be read. Try choosing it again.');
      input.value = '';
      return;
    }
    let parsed: unknown;
    try {
      parsed = JSON.parse(text);
    } catch {
      setProblem('That file is not a Scrubline season file (it is not JSON). Use the “Download everything (JSON)” file.');
      input.value = '';
      return;
    }
    importing.mutate(parsed, {
      onError: (error) => setProblem(describeError(error)),
      onSettled: () => {
        input.value = '';
      },
    });
  };

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-col gap-2">
        <a href={seasonFileUrl(carId, 'csv')} download className={buttonClasses('secondary', 'self-start')}>
          <Download aria-hidden="true" className="size-5" /> Download runs and setups (CSV)
        </a>
        <a href={seasonFileUrl(carId, 'json')} download className={buttonClasses('secondary', 'self-start')}>
          <Download aria-hidden="true" className="size-5" /> Download everything (JSON)
        </a>
        <p className="text-sm text-ink-muted">
          The spreadsheet has one row per run with the setup it ran on, in SI units. The JSON file holds the whole season
          (setups, runs, events, pressures, tyres, change log) and can be brought into another account. Comments are not included.
        </p>
      </div>
      <div className="flex flex-col gap-2">
        <label htmlFor={inputId} className="inline-flex items-center gap-2 font-semibold">
          <Upload aria-hidden="true" className="size-5" /> Bring a car in from a Scrubline file
        </label>
        <input
          id={inputId}
          type="file"
          accept="application/json,.json"
          aria-describedby={hintId}
          disabled={importing.isPending}
          onChange={(e) => void onFile(e)}
          className="min-h-tap w-full min-w-0 text-sm file:mr-3 file:min-h-tap file:rounded file:border file:border-line-strong file:bg-surface file:px-4 file:font-bold"
        />
        <p id={hintId} className="text-sm text-ink-muted">
          {importing.isPending ? 'Bringing the car in…' : 'The file becomes a new car of yours, with its own copy of every record.'}
        </p>
        {problem ? (
          <p role="alert" className="text-sm font-semibold text-warning">
            {problem}
          </p>
        ) : null}
      </div>
    </div>
  );
}
