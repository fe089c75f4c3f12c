import { useRef, useState, type FormEvent } from 'react';
import { CORNERS, type PerCorner } from '@shared/season/corners';
import { RUN_STATUSES, type RunStatus } from '@shared/season/run.schema';
import { formatRunTime, readRunTimeBox } from '@shared/season/run-time';
import { Button } from '@/components/ui/button';
import { SegmentedControl } from '@/components/ui/segmented-control';
import { Stepper } from '@/components/ui/stepper';
import { TextField } from '@/components/ui/text-field';
import { toInputText, unitSymbol } from '@/lib/numbers';
import { useUnits } from '@/lib/units-context';
import { hotField, hotFieldErrors, readPressures, type CornerTextMap } from '../utils/hot-pressures';
import type { RunRow } from '../utils/merge-runs';
import { anyRefused, showFirstRefused, type RunFormErrors } from '../utils/run-form';
import { readRunNumber } from '../utils/run-number';
import { STATUS_WORDS } from '../utils/run-words';
import { HotPressureGrid } from './hot-pressure-grid';

export interface RunChanges {
  runNumber: number;
  rawTimeSec: number | null;
  cones: number;
  status: RunStatus;
  notes: string | null;
  /**
   * Only when a hot pressure was changed: the run's whole set in kPa (a corner left out is cleared), or null
   * when none is left. Absent, the saved hot pressures stay as they are.
   */
  hotPressuresKpa?: PerCorner<number> | null;
}

interface RunEditFormProps {
  row: RunRow;
  /** Other runs of the same driver, to refuse a number twice. */
  takenNumbers: readonly number[];
  /** The server's messages by field, when it refused this run. */
  serverErrors?: Record<string, string[]>;
  /** The server refused the run because its number was taken (a conflict): the next free one is offered. */
  numberTaken?: boolean;
  submitLabel: string;
  onSubmit: (changes: RunChanges) => Promise<void> | void;
  onCancel: () => void;
  /** Absent when the run cannot be deleted from here (a refused upload is discarded instead). */
  onDelete?: () => void;
}

/** Fixing a run after the fact: time, cones, result, number, hot pressures, note. */
export function RunEditForm({ row, takenNumbers, serverErrors, numberTaken = false, submitLabel, onSubmit, onCancel, onDelete }: RunEditFormProps) {
  const units = useUnits();
  const formRef = useRef<HTMLFormElement>(null);
  const [time, setTime] = useState(row.rawTimeSec !== null ? formatRunTime(row.rawTimeSec) : '');
  const [cones, setCones] = useState(row.cones);
  const [status, setStatus] = useState<RunStatus>(row.status);
  // The server found the number taken (logged on another phone, or in another tab): the next one free here is offered.
  const nextFree = numberTaken ? Math.max(row.runNumber, ...takenNumbers) + 1 : null;
  const [number, setNumber] = useState(String(nextFree ?? row.runNumber));
  const [notes, setNotes] = useState(row.notes ?? '');
  // The saved hot pressures as the driver types them (rounded to the unit's decimals), to tell what was changed.
  const [savedHot] = useState(
    () => Object.fromEntries(CORNERS.map((c) => [c, toInputText(row.hotPressuresKpa?.[c], 'pressure', units)])) as CornerTextMap,
  );
  const [hot, setHot] = useState(savedHot);
  const [errors, setErrors] = useState<RunFormErrors>(() => ({
    ...Object.fromEntries(Object.entries(serverErrors ?? {}).map(([k, v]) => [k, v.join(' ')])),
    ...(nextFree ? { runNumber: `Run ${row.runNumber} was already logged, so run ${nextFree} is filled in: the next number free here. Check it, then send again.` } : {}),
  }));

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    const found: RunFormErrors = {};
    const timeRead = readRunTimeBox(time, status);
    if (!timeRead.ok) found.rawTimeSec = timeRead.error;
    const rawTimeSec = timeRead.ok ? timeRead.seconds : null;
    const read = readRunNumber(number);
    if (!read.ok) found.runNumber = read.error;
    else if (takenNumbers.includes(read.value)) found.runNumber = `Run ${read.value} is already logged for ${row.driver.displayName}`;

    // Hot pressures go with the save only when one was changed; a corner left as it was keeps its saved value
    // exactly, not the rounded number shown in psi or kPa.
    let hotPressuresKpa: PerCorner<number> | null | undefined;
    if (CORNERS.some((c) => hot[c] !== savedHot[c])) {
      const typed = readPressures(hot, units);
      Object.assign(found, hotFieldErrors(typed.errors));
      const kpa: PerCorner<number> = {};
      for (const c of CORNERS) {
        const value = hot[c] === savedHot[c] ? row.hotPressuresKpa?.[c] : typed.kpa?.[c];
        if (value !== undefined) kpa[c] = value;
      }
      hotPressuresKpa = Object.keys(kpa).length ? kpa : null;
    }

    if (!read.ok || anyRefused(found)) {
      // Nothing typed is cleared: fix the marked part and save again.
      setErrors(found);
      showFirstRefused(formRef.current);
      return;
    }
    await onSubmit({
      runNumber: read.value,
      rawTimeSec,
      cones,
      status,
      notes: notes.trim() || null,
      ...(hotPressuresKpa !== undefined ? { hotPressuresKpa } : {}),
    });
  };

  const pressureUnit = unitSymbol('pressure', units);

  return (
    <form ref={formRef} onSubmit={(e) => void submit(e)} noValidate aria-label={`Edit run ${row.runNumber}`} className="flex flex-col gap-3 border-t border-line pt-3">
      <div className="grid grid-cols-[1fr_8rem] gap-3">
        <TextField
          label="Raw time"
          inputMode="decimal"
          autoComplete="off"
          className="tabular-figures"
          value={time}
          error={errors.rawTimeSec}
          onChange={(e) => {
            setTime(e.target.value);
            setErrors((er) => ({ ...er, rawTimeSec: undefined }));
          }}
        />
        <TextField
          label="Run number"
          inputMode="numeric"
          autoComplete="off"
          value={number}
          error={errors.runNumber}
          onChange={(e) => {
            setNumber(e.target.value);
            setErrors((er) => ({ ...er, runNumber: undefined }));
          }}
        />
      </div>
      <div className="flex flex-col gap-1">
        <span className="text-sm font-semibold">Cones</span>
        <Stepper label="Cones" value={cones} min={0} max={50} onChange={setCones} size="md" />
        {errors.cones ? <p className="text-sm font-semibold text-warning">{errors.cones}</p> : null}
      </div>
      <SegmentedControl
        label="Result"
        options={RUN_STATUSES.map((s) => ({ value: s, label: STATUS_WORDS[s] }))}
        value={status}
        onChange={setStatus}
      />
      <div className="flex flex-col gap-1">
        <HotPressureGrid
          unit={pressureUnit}
          values={hot}
          errors={errors}
          onChange={(corner, text) => {
            setHot((h) => ({ ...h, [corner]: text }));
            setErrors((er) => ({ ...er, [hotField(corner)]: undefined }));
          }}
        />
        <p className="text-sm text-ink-muted">Empty a corner to clear its reading.</p>
      </div>
      <TextField label="Note" value={notes} maxLength={2000} error={errors.notes} onChange={(e) => setNotes(e.target.value)} />
      {errors._ ? <p className="text-sm font-semibold text-warning">{errors._}</p> : null}
      <Button type="submit" className="min-h-tap-lg w-full text-lg">
        {submitLabel}
      </Button>
      <div className="flex gap-2">
        <Button variant="secondary" className="flex-1" onClick={onCancel}>
          Cancel
        </Button>
        {onDelete ? (
          <Button variant="secondary" className="flex-1" onClick={onDelete}>
            Delete run
          </Button>
        ) : null}
      </div>
    </form>
  );
}
