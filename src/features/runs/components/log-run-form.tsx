import { useEffect, useRef, useState, type FormEvent } from 'react';
import { ChevronDown, ChevronUp } from 'lucide-react';
import { adjustedTimeSec } from '@shared/calc/scoring.calc';
import type { Person } from '@shared/season/car.schema';
import { createRunInputSchema, type RunStatus } from '@shared/season/run.schema';
import { formatRunTime, parseRunTime, readRunTimeBox } from '@shared/season/run-time';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { Stepper } from '@/components/ui/stepper';
import { runMoment } from '@/lib/dates';
import { unitSymbol } from '@/lib/numbers';
import { useUnits } from '@/lib/units-context';
import { createRunEntry, useCreateRun, type CreateRunBody } from '../api/create-run';
import { nextRunNumber, type RunRow } from '../utils/merge-runs';
import { readRunNumber } from '../utils/run-number';
import { emptyCornerText, hotField, hotFieldErrors, readPressures, type CornerTextMap } from '../utils/hot-pressures';
import { anyRefused, showFirstRefused, type RunFormErrors } from '../utils/run-form';
import { coneWords, runLabel, STATUS_WORDS } from '../utils/run-words';
import { HotPressureGrid } from './hot-pressure-grid';
import { TimeKeypad } from './time-keypad';

interface LogRunFormProps {
  carId: string;
  eventId: string;
  /** The event's calendar date: a run logged after that day is tied to the setup the car ended it with. */
  eventDate: string;
  driver: Person;
  conePenaltySec: number;
  /** Today's runs of this car, saved and waiting: for the next run number and to refuse a number twice. */
  rows: readonly RunRow[];
}

/**
 * The fields this form marks itself, each corner's hot pressure among them; a refusal of any other part of the
 * run is shown over the Save bar.
 */
const SHOWN = /^(rawTimeSec|runNumber|cones|hot)/;


/**
 * Logging a run: type the time on the keypad and tap Save (cones and DNF/off course one tap
 * each). Written to the outbox on the device at once — no signal needed — and shown in the list
 * straight away as waiting to upload.
 */
export function LogRunForm({ carId, eventId, eventDate, driver, conePenaltySec, rows }: LogRunFormProps) {
  const units = useUnits();
  const write = useCreateRun();
  const [timeText, setTimeText] = useState('');
  const [status, setStatus] = useState<RunStatus>('finished');
  const [cones, setCones] = useState(0);
  const [runNumberText, setRunNumberText] = useState('');
  const [extras, setExtras] = useState(false);
  const [hot, setHot] = useState<CornerTextMap>(emptyCornerText);
  const [notes, setNotes] = useState('');
  const [errors, setErrors] = useState<RunFormErrors>({});
  const [saved, setSaved] = useState<string | null>(null);
  const formRef = useRef<HTMLFormElement>(null);
  const barRef = useRef<HTMLDivElement>(null);

  // On a short phone (320 × 640) the page's header and the setup line push the keypad under the Save bar. When
  // the form first shows at the top of today's page, the page moves up just enough to bring the last row of keys
  // above the bar, never taking the form's own top under the header; later scrolling is the driver's own.
  useEffect(() => {
    if (runMoment(eventDate).dayOver) return;
    const frame = requestAnimationFrame(() => {
      const form = formRef.current;
      const lastKey = form?.querySelector('[aria-label="Time keypad"] > :last-child');
      if (!form || !lastKey || !barRef.current || window.scrollY > 0) return;
      const under = lastKey.getBoundingClientRect().bottom - barRef.current.getBoundingClientRect().top;
      const headerBottom = document.querySelector('header')?.getBoundingClientRect().bottom ?? 0;
      if (under > 0) window.scrollBy(0, Math.min(under + 8, form.getBoundingClientRect().top - headerBottom - 8));
    });
    return () => cancelAnimationFrame(frame);
  }, [eventDate]);

  const next = nextRunNumber(rows, driver.id);
  // The run number as typed, or the next one: the Save button names it once it reads as a run number.
  const typed = runNumberText.trim() ? readRunNumber(runNumberText) : { ok: true as const, value: next };
  const parsed = timeText.trim() ? parseRunTime(timeText) : null;
  const preview = (() => {
    if (!parsed?.ok) return null;
    const shown = formatRunTime(parsed.seconds);
    const adjusted = adjustedTimeSec({ rawTimeSec: parsed.seconds, cones, status }, conePenaltySec);
    const parts = [shown !== timeText.trim() ? `Reads as ${shown}` : null, cones && adjusted !== null ? `Adjusted ${formatRunTime(adjusted)} with ${coneWords(cones)}` : null];
    return parts.filter(Boolean).join(' · ') || null;
  })();

  const changeTime = (text: string) => {
    setTimeText(text);
    setSaved(null);
    if (errors.rawTimeSec) setErrors((e) => ({ ...e, rawTimeSec: undefined }));
  };

  const pasteTime = (text: string) => {
    setTimeText(text);
    setSaved(null);
    const result = parseRunTime(text);
    setErrors((e) => ({ ...e, rawTimeSec: result.ok ? undefined : result.error }));
  };

  const onSubmit = async (event: FormEvent) => {
    event.preventDefault();
    const found: RunFormErrors = {};
    const time = readRunTimeBox(timeText, status);
    if (!time.ok) found.rawTimeSec = time.error;
    const rawTimeSec = time.ok ? time.seconds : null;
    // Read as the run editor reads it (see typed above).
    const runNumber = typed.ok ? typed.value : next;
    if (!typed.ok) found.runNumber = typed.error;
    if (!found.runNumber && rows.some((r) => r.driver.id === driver.id && r.runNumber === runNumber)) {
      found.runNumber = `Run ${runNumber} is already logged for ${driver.displayName}; the next is ${next}`;
    }
    const pressures = readPressures(hot, units);
    Object.assign(found, hotFieldErrors(pressures.errors));

    const body: CreateRunBody = {
      id: crypto.randomUUID(),
      carId,
      eventId,
      runNumber,
      rawTimeSec,
      cones,
      status,
      recordedAt: runMoment(eventDate).at.toISOString(),
      driverId: driver.id,
      ...(pressures.kpa ? { hotPressuresKpa: pressures.kpa } : {}),
      ...(notes.trim() ? { notes: notes.trim() } : {}),
    };
    if (!anyRefused(found)) {
      // What the server would refuse, under the field it would name; what the form has no field for, over the Save bar.
      for (const issue of createRunInputSchema.safeParse(body).error?.issues ?? []) {
        const field = issue.path.join('.');
        found[SHOWN.test(field) ? field : '_'] ??= issue.message;
      }
    }
    if (anyRefused(found)) {
      // Nothing typed is cleared: fix the marked part and save again.
      setErrors(found);
      if (Object.keys(found).some((f) => f.startsWith('hot'))) setExtras(true);
      showFirstRefused(formRef.current);
      return;
    }
    await write.mutateAsync(createRunEntry(body));
    setSaved(`${runLabel(body)} saved on this phone.`);
    setErrors({});
    setTimeText('');
    setCones(0);
    setStatus('finished');
    setRunNumberText('');
    setHot(emptyCornerText());
    setNotes('');
    setExtras(false);
  };

  const pressureUnit = unitSymbol('pressure', units);
  const refused = anyRefused(errors);
  return (
    <form ref={formRef} onSubmit={(e) => void onSubmit(e)} noValidate aria-label="Log a run" className="flex flex-col gap-3">
      {/* Over the number's field: under the keypad it would read as the time's. */}
      {errors.runNumber ? (
        <p id="run-number-note" className="-mb-2 text-sm font-semibold text-warning">
          {errors.runNumber}
        </p>
      ) : null}
      <TimeKeypad
        value={timeText}
        onChange={changeTime}
        onPaste={pasteTime}
        preview={preview}
        error={errors.rawTimeSec ?? null}
        label={`Raw time · ${driver.displayName}`}
        idleNote={status !== 'finished' ? `${STATUS_WORDS[status]}: a time is optional.` : saved}
        status={{ value: status, onChange: setStatus }}
        aside={
          <label className="flex shrink-0 items-center gap-2">
            {/* "Run" alone keeps the time's label on one line, so the keypad fits above the Save bar. */}
            <span className="text-sm font-semibold">Run</span>
            <input
              aria-label="Run number"
              type="text"
              inputMode="numeric"
              autoComplete="off"
              placeholder={String(next)}
              value={runNumberText}
              onChange={(e) => {
                setRunNumberText(e.target.value.slice(0, 4));
                setErrors((er) => ({ ...er, runNumber: undefined }));
              }}
              aria-invalid={errors.runNumber ? true : undefined}
              aria-describedby="run-number-note"
              className="tabular-figures min-h-tap w-16 rounded border border-line-strong bg-surface px-2 text-center text-xl font-bold placeholder:text-ink aria-[invalid=true]:border-2 aria-[invalid=true]:border-warning"
            />
          </label>
        }
      />

      <div className="flex flex-col gap-3">
        <button
          type="button"
          aria-expanded={extras}
          onClick={() => setExtras((v) => !v)}
          className="inline-flex min-h-tap items-center gap-2 self-start font-semibold text-link"
        >
          {extras ? <ChevronUp aria-hidden="true" className="size-5" /> : <ChevronDown aria-hidden="true" className="size-5" />}
          Hot pressures and note (optional)
        </button>
        {extras ? (
          <div className="flex flex-col gap-3">
            <HotPressureGrid
              unit={pressureUnit}
              values={hot}
              errors={errors}
              onChange={(corner, text) => {
                setHot((h) => ({ ...h, [corner]: text }));
                setErrors((er) => ({ ...er, [hotField(corner)]: undefined }));
              }}
            />
            <label className="flex flex-col gap-1">
              <span className="font-semibold">Note</span>
              <input
                type="text"
                maxLength={2000}
                value={notes}
                onChange={(e) => setNotes(e.target.value)}
                className="min-h-tap rounded border border-line-strong bg-surface px-3 text-base"
              />
            </label>
          </div>
        ) : null}
      </div>

      <FormAlert message={errors._} />
      {/*
        On a phone the cones and the Save button stay in thumb reach above the bottom bar while the form is in view:
        the two taps after every run, never under the bar. The confirmation sits under the time, so the bar keeps
        its height.
      */}
      <div ref={barRef} className="sticky bottom-[calc(3.5rem+1px+env(safe-area-inset-bottom))] z-10 -mx-3 -mb-3 flex flex-col gap-1 rounded-b-lg border-t border-line bg-surface px-3 py-2 max-[359px]:px-2 md:static">
        <p role="alert" className="text-sm font-semibold text-warning empty:hidden">
          {refused ? 'Not saved: fix what is marked.' : null}
        </p>
        {errors.cones ? <p className="text-sm font-semibold text-warning">{errors.cones}</p> : null}
        <div className="flex flex-wrap items-center gap-2">
          {/* One row on the narrowest phones too (320 px): a second row would hide the keypad's last keys. */}
          <Stepper label="Cones" value={cones} min={0} max={50} onChange={setCones} caption={cones === 1 ? 'cone' : 'cones'} squeeze />
          <Button type="submit" className="min-h-tap-lg min-w-24 flex-1 px-3 text-lg max-[359px]:px-2 max-[359px]:text-base" isPending={write.isPending} pendingLabel="Saving…">
            {typed.ok ? `Save run ${typed.value}` : 'Save run'}
          </Button>
        </div>
      </div>
    </form>
  );
}

