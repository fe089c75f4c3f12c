import { useId, type ClipboardEvent, type ReactNode } from 'react';
import { Delete } from 'lucide-react';
import type { RunStatus } from '@shared/season/run.schema';
import { cn } from '@/lib/cn';
import { STATUS_WORDS } from '../utils/run-words';

const MAX_LENGTH = 9;
const BACKSPACE = '⌫';
/** The keys, row by row as drawn (four to a row; "0" spans three, or one beside DNF and Off course); "Clear" ends the last row. */
const KEYS = [...'123', BACKSPACE, ...'456:789.0'];
/** What a screen reader says for the keys that are not digits. */
const KEY_NAMES: Partial<Record<string, string>> = { [BACKSPACE]: 'Backspace', ':': 'Colon', '.': 'Point' };

/** Keeps what a time can hold: digits, one colon, a decimal point (or comma). */
export function cleanTimeText(text: string): string {
  return text.replace(/[^\d:.,]/g, '').slice(0, MAX_LENGTH);
}

interface TimeKeypadProps {
  value: string;
  onChange: (text: string) => void;
  /** Pasted text, as pasted (a timing sheet's "1:05.432"); the form reads it and says what is wrong. */
  onPaste: (text: string) => void;
  /** What the typed time reads as, e.g. "= 1:05.432", or the adjusted time. */
  preview?: string | null;
  error?: string | null;
  label?: string;
  /** Drawn at the end of the label's row (the run number). */
  aside?: ReactNode;
  /** What the note under the time says while there is nothing else to say (the last run saved); else how to type. */
  idleNote?: string | null;
  /**
   * How the run ended, chosen on the keypad's last row: DNF and Off course are keys held down once pressed (pressed
   * again, the run is finished), so a run without a time is logged from the first screen, above the Save bar.
   */
  status?: { value: RunStatus; onChange: (status: RunStatus) => void };
}

/**
 * The time, typed with gloves on: a big display and a keypad of 56 px keys (digits, point, colon,
 * backspace). The display is a real input, so a keyboard or a paste from a timing sheet works too;
 * it opens no on-screen keyboard of its own on a phone.
 */
export function TimeKeypad({ value, onChange, onPaste, preview, error, label = 'Raw time', aside, idleNote, status }: TimeKeypadProps) {
  const id = useId();
  const press = (key: string) => onChange(cleanTimeText(value + key));
  const key = 'inline-flex min-h-tap-lg items-center justify-center rounded border border-line-strong bg-surface text-2xl font-bold text-ink select-none hover:bg-surface-raised active:bg-accent-soft';

  const handlePaste = (event: ClipboardEvent<HTMLInputElement>) => {
    event.preventDefault();
    const text = event.clipboardData.getData('text/plain') || event.clipboardData.getData('text');
    onPaste(text.trim());
  };

  return (
    <div className="flex flex-col gap-2">
      <div className="flex items-end justify-between gap-3">
        <label htmlFor={id} className="text-sm font-semibold">
          {label}
        </label>
        {aside}
      </div>
      <div className={cn('flex items-center rounded border bg-surface px-3', error ? 'border-2 border-warning' : 'border-line-strong')}>
        <input
          id={id}
          type="text"
          inputMode="none"
          autoComplete="off"
          spellCheck={false}
          placeholder="0.000"
          value={value}
          onChange={(e) => onChange(cleanTimeText(e.target.value))}
          onPaste={handlePaste}
          aria-invalid={error ? true : undefined}
          aria-describedby={`${id}-note`}
          className="tabular-figures min-h-tap-lg w-full min-w-0 bg-transparent text-right text-time-xl text-ink outline-none placeholder:text-line-strong"
        />
        <span className="pl-2 text-lg font-semibold text-ink-muted">s</span>
      </div>
      {/* Polite: a saved run, or what the typed time reads as, is heard once it changes; an error at once. */}
      <p
        id={`${id}-note`}
        role={error ? 'alert' : undefined}
        aria-live="polite"
        className={cn('tabular-figures min-h-6 text-sm font-semibold', error ? 'text-warning' : !preview && idleNote ? 'text-ink' : 'text-ink-muted')}
      >
        {error ?? preview ?? idleNote ?? 'Type or paste: 45.678 or 1:05.432'}
      </p>
      <div className="grid grid-cols-4 gap-2" role="group" aria-label="Time keypad">
        {KEYS.map((k) => (
          <button
            key={k}
            type="button"
            className={cn(key, k === '0' && !status && 'col-span-3')}
            aria-label={KEY_NAMES[k]}
            onClick={() => (k === BACKSPACE ? onChange(value.slice(0, -1)) : press(k))}
          >
            {k === BACKSPACE ? <Delete aria-hidden="true" className="size-7" /> : k}
          </button>
        ))}
        {status
          ? (['dnf', 'off_course'] as const).map((s) => (
              <button
                key={s}
                type="button"
                aria-pressed={status.value === s}
                className={cn(key, 'text-base leading-tight aria-pressed:border-accent aria-pressed:bg-accent aria-pressed:text-accent-ink')}
                onClick={() => status.onChange(status.value === s ? 'finished' : s)}
              >
                {status.value === s ? <span aria-hidden="true">✓&nbsp;</span> : null}
                {STATUS_WORDS[s]}
              </button>
            ))
          : null}
        <button type="button" className={cn(key, 'text-base')} onClick={() => onChange('')}>
          Clear
        </button>
      </div>
    </div>
  );
}
