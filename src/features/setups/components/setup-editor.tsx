import { useEffect, useMemo, useRef, useState } from 'react';
import { useForm, useWatch, type Path } from 'react-hook-form';
import { Link } from 'react-router-dom';
import type { Car } from '@shared/season/car.schema';
import { AXLES, CORNERS, type Corner } from '@shared/season/corners';
import { adjusterFor, isClickField } from '@shared/season/damper-clicks';
import { createSetupInputSchema, SETUP_CORNER_FIELDS, type SetupCorner } from '@shared/season/setup.schema';
import { diffSetups } from '@shared/season/setup-diff';
import { CORNER_NAMES, CornerGrid } from '@/components/corner-grid/corner-grid';
import { Button } from '@/components/ui/button';
import { Caution } from '@/components/ui/caution';
import { FormAlert } from '@/components/ui/form-alert';
import { TextField } from '@/components/ui/text-field';
import { UnitInput } from '@/components/ui/unit-input';
import { pathTo } from '@/config/paths';
import { fromLocalInputValue, toLocalInputValue } from '@/lib/dates';
import { unitSymbol } from '@/lib/numbers';
import type { OutboxEntry } from '@/lib/outbox';
import { useOutbox } from '@/lib/outbox-context';
import { useUnits } from '@/lib/units-context';
import { useWatchedEntry } from '@/lib/use-outbox-entry';
import { createSetupEntry, useCreateSetup, type CreateSetupBody } from '../api/create-setup';
import { FIELD_INFO, formatFieldChange } from '@/lib/setup-fields';
import { compactCorners, cornersToTexts, textsToSi, type SetupFormValues } from '../utils/setup-form';
import { setupInForce, type SetupView } from '../utils/setup-views';
import { SetupChangeList } from './setup-change-list';
import { SAVE_BAR_CLASSES } from '@/components/layouts/save-bar';

const emptyAxles = { front: { antiRollBar: null }, rear: { antiRollBar: null } };

interface SetupEditorProps {
  car: Car;
  /** Saved and pending snapshots of the car, newest first. */
  setups: readonly SetupView[];
  /** Start from this snapshot (?from=…); otherwise from the one in force now. */
  fromId?: string | null;
  /** A refused entry being fixed (?fix=…): its values and the server's errors are loaded. */
  fixEntry?: OutboxEntry | null;
  /** Called once the server has the snapshot. */
  /** The new snapshot reached the server; its id, for the page to open at. */
  onUploaded: (setupId: string) => void;
}

const SERVER_FIELDS = new Set<string>([
  'label',
  'effectiveFrom',
  'notes',
  'axles.front.antiRollBar',
  'axles.rear.antiRollBar',
  ...CORNERS.flatMap((c) => SETUP_CORNER_FIELDS.map((f) => `corners.${c}.${f}`)),
]);

/**
 * Every setup value per corner, typed in the user's units, with the difference from the snapshot
 * it starts from; saved as a new snapshot through the outbox. The server's answer arrives later
 * (the outbox uploads when it can): its field errors are put on the inputs they name.
 */
export function SetupEditor({ car, setups, fromId, fixEntry, onUploaded }: SetupEditorProps) {
  const units = useUnits();
  const outbox = useOutbox();
  const write = useCreateSetup();
  const fixBody = (fixEntry?.body ?? null) as CreateSetupBody | null;
  const [recordId] = useState(() => fixBody?.id ?? crypto.randomUUID());
  const others = useMemo(() => setups.filter((s) => s.id !== recordId), [setups, recordId]);

  // What the new snapshot is compared with, and what the inputs start from.
  const [start] = useState(() => {
    const base =
      (fixBody?.derivedFromId ? others.find((s) => s.id === fixBody.derivedFromId) : null) ??
      (fromId ? others.find((s) => s.id === fromId) : null) ??
      setupInForce(others, new Date().toISOString());
    const sourceCorners: Partial<Record<Corner, SetupCorner>> | undefined = fixBody ? fixBody.corners : base?.corners;
    const texts = cornersToTexts(sourceCorners, units);
    const axles = fixBody?.axles ?? base?.axles ?? emptyAxles;
    const values: SetupFormValues = {
      label: fixBody?.label ?? '',
      effectiveFrom: toLocalInputValue(fixBody?.effectiveFrom ?? new Date()),
      notes: fixBody?.notes ?? '',
      corners: texts,
      axles: { front: { antiRollBar: axles.front?.antiRollBar ?? '' }, rear: { antiRollBar: axles.rear?.antiRollBar ?? '' } },
    };
    return { base, sourceCorners, texts, values };
  });
  const { base } = start;

  const { register, handleSubmit, control, setError, clearErrors, formState } = useForm<SetupFormValues>({ defaultValues: start.values });
  const errors = formState.errors;
  const [entryKey, setEntryKey] = useState<string | null>(fixEntry?.key ?? null);
  const [formError, setFormError] = useState<string | null>(null);
  const watched = useWatchedEntry(entryKey);

  // The server refused the snapshot: its messages go on the inputs; what was typed stays.
  const refusal = watched.status === 'failed' ? watched.entry.error : undefined;
  const shownRefusal = useRef<unknown>(null);
  useEffect(() => {
    if (!refusal || shownRefusal.current === refusal) return;
    shownRefusal.current = refusal;
    const leftOver: string[] = [];
    let focus = true;
    for (const [key, messages] of Object.entries(refusal.fieldErrors ?? {})) {
      if (SERVER_FIELDS.has(key)) {
        setError(key as Path<SetupFormValues>, { type: 'server', message: messages.join(' ') }, { shouldFocus: focus });
        focus = false;
      } else leftOver.push(messages.join(' '));
    }
    // `focus` is spent once a message went on an input; a refusal with none there (a 403) says its own reason.
    setFormError(leftOver.length ? leftOver.join(' ') : !focus ? 'The server refused some values; they are marked above.' : refusal.message);
  }, [refusal, setError]);

  const uploaded = watched.status === 'delivered';
  const told = useRef(false);
  useEffect(() => {
    if (!uploaded || told.current) return;
    told.current = true;
    onUploaded(recordId);
  }, [uploaded, onUploaded, recordId]);

  // Every value, live, for the diff (the defaults fill every field, so nothing is missing).
  const values = useWatch({ control }) as SetupFormValues;
  const draft = textsToSi(values.corners, start.texts, start.sourceCorners, units, car);
  const changes = diffSetups(base ?? { corners: {} as never, axles: emptyAxles }, {
    corners: draft.corners,
    axles: {
      front: { antiRollBar: values.axles.front.antiRollBar.trim() || null },
      rear: { antiRollBar: values.axles.rear.antiRollBar.trim() || null },
    },
  });

  const field = (name: Path<SetupFormValues>) => register(name, { onChange: () => clearErrors(name) });

  const onSubmit = handleSubmit(async (v) => {
    setFormError(null);
    const converted = textsToSi(v.corners, start.texts, start.sourceCorners, units, car);
    const effectiveFrom = fromLocalInputValue(v.effectiveFrom);
    // In the page's order, so the focus goes to the first one on screen: the label and the date sit above the grid.
    const local: Record<string, string> = {};
    if (!v.label.trim()) local.label = 'Give the setup a label, e.g. “After alignment”';
    if (!effectiveFrom) local.effectiveFrom = 'Pick the date and time this setup went on the car';
    Object.assign(local, converted.errors);
    const body: CreateSetupBody = {
      id: recordId,
      label: v.label.trim(),
      effectiveFrom: effectiveFrom ?? '',
      corners: compactCorners(converted.corners),
      axles: {
        front: { antiRollBar: v.axles.front.antiRollBar.trim() || null },
        rear: { antiRollBar: v.axles.rear.antiRollBar.trim() || null },
      },
      derivedFromId: base?.id ?? null,
      ...(v.notes.trim() ? { notes: v.notes.trim() } : {}),
    };
    if (Object.keys(local).length === 0) {
      const checked = createSetupInputSchema.safeParse(body);
      if (!checked.success) for (const issue of checked.error.issues) local[issue.path.map(String).join('.')] ??= issue.message;
    }
    const keys = Object.keys(local);
    if (keys.length) {
      keys.forEach((key, i) => {
        if (SERVER_FIELDS.has(key)) setError(key as Path<SetupFormValues>, { type: 'client', message: local[key] }, { shouldFocus: i === 0 });
      });
      const stray = keys.filter((k) => !SERVER_FIELDS.has(k));
      setFormError(stray.length ? stray.map((k) => local[k]).join(' ') : 'Some values need attention; they are marked above.');
      return;
    }
    if (entryKey && watched.status === 'failed') {
      await outbox.retry(entryKey, body);
      return;
    }
    const entry = await write.mutateAsync(createSetupEntry(car.id, body));
    if (entry) setEntryKey(entry.key);
  });

  const waiting = watched.status === 'waiting';
  const reason = outbox.retryReason();

  return (
    <form onSubmit={(e) => void onSubmit(e)} noValidate aria-label="New setup" className="flex flex-col gap-6">
      <div className="grid grid-cols-1 gap-4 md:grid-cols-2">
        <TextField label="Label" placeholder="e.g. After alignment" maxLength={80} error={errors.label?.message} {...field('label')} />
        <TextField
          label="On the car from"
          type="datetime-local"
          hint="Runs from this time on are tied to this setup."
          error={errors.effectiveFrom?.message}
          {...field('effectiveFrom')}
        />
      </div>
      <p className="text-sm text-ink-muted">
        {base ? (
          <>
            Starts from <span className="font-semibold text-ink">{base.label}</span>; every value shows its change from it.
          </>
        ) : (
          'The first setup of this car: record what you know, leave the rest empty.'
        )}
      </p>

      <div className="grid grid-cols-1 gap-6 md:grid-cols-2">
        {SETUP_CORNER_FIELDS.map((name) => {
          const info = FIELD_INFO[name];
          const unit = info.quantity ? unitSymbol(info.quantity, units) : 'clicks';
          // "Clicks (clicks)" says the word twice: a count names its own unit.
          const heading = info.label.toLowerCase().endsWith(unit) ? null : unit;
          // Each axle's adjuster for these clicks (rebound clicks: the rebound adjuster, where the car describes one;
          // else the damper's one adjuster, which the Clicks grid sets too, and the hint says so).
          const adjusters = isClickField(name)
            ? AXLES.flatMap((axle) => {
                const a = adjusterFor(car.damperAdjusters, axle, name);
                return a ? [{ axle, ...a, shared: name === 'damperReboundClicks' && !car.damperAdjusters[axle]?.rebound }] : [];
              })
            : [];
          return (
            <section key={name} className="flex flex-col gap-1" aria-label={info.label}>
              <CornerGrid
                label={heading ? `${info.label} (${heading})` : info.label}
                title={
                  <span>
                    {info.label}
                    {heading ? <span className="font-normal text-ink-muted"> ({heading})</span> : null}
                  </span>
                }
                cornerInvalid={(corner) => Boolean(errors.corners?.[corner]?.[name])}
                renderCorner={(corner) => {
                  const before = base?.corners[corner]?.[name] ?? null;
                  const now = draft.corners[corner]?.[name] ?? null;
                  const hint =
                    before !== null && now !== null && now !== before
                      ? formatFieldChange(name, before, now, units)
                      : before === null && now !== null && base
                        ? 'new'
                        : before !== null && now === null && !draft.errors[`corners.${corner}.${name}`]
                          ? 'cleared'
                          : null;
                  return (
                    <UnitInput
                      label={`${CORNER_NAMES[corner]} ${info.label.toLowerCase()}`}
                      hideLabel
                      unit={unit}
                      signed={info.signed}
                      {...(info.quantity ? {} : { inputMode: 'numeric' as const })}
                      hint={hint}
                      error={errors.corners?.[corner]?.[name]?.message}
                      {...field(`corners.${corner}.${name}`)}
                    />
                  );
                }}
              />
              {info.note ? <p className="text-xs text-ink-muted">{info.note}</p> : null}
              {adjusters.length > 0 ? (
                <p className="text-xs text-ink-muted">
                  {adjusters
                    .map(
                      (a) =>
                        `${a.axle === 'front' ? 'Front' : 'Rear'}: 0 to ${a.positions}, counted from full ${a.countFrom === 'full_stiff' ? 'stiff' : 'soft'}${a.shared ? ' (no rebound adjuster of its own: the same adjuster as its clicks)' : ''}`,
                    )
                    .join(' · ')}
                </p>
              ) : null}
            </section>
          );
        })}
        <section className="flex flex-col gap-3" aria-label="Anti-roll bars">
          <h3 className="font-semibold">Anti-roll bars</h3>
          <TextField label="Front anti-roll bar" hint="A setting or hole, e.g. “hole 2”." maxLength={40} error={errors.axles?.front?.antiRollBar?.message} {...field('axles.front.antiRollBar')} />
          <TextField label="Rear anti-roll bar" maxLength={40} error={errors.axles?.rear?.antiRollBar?.message} {...field('axles.rear.antiRollBar')} />
        </section>
      </div>

      <label className="flex flex-col gap-1">
        <span className="font-semibold">Notes (optional)</span>
        <textarea rows={3} maxLength={2000} className="rounded border border-line-strong bg-surface p-3 text-base" {...field('notes')} />
      </label>

      <Caution title="Before you touch the car">
        <p>
          Support the car on stands on firm, level ground — never work under a car held only by a jack. Compress springs only with a
          proper spring compressor. Have alignment and corner weights checked by a qualified technician, and follow the
          manufacturer’s data and your event’s rules.
        </p>
      </Caution>

      <section aria-label="Changes from the starting setup" className="flex flex-col gap-2 rounded-lg border border-line bg-surface p-4">
        <h3 className="font-bold">{base ? `Changes from “${base.label}”` : 'Values entered'}</h3>
        <SetupChangeList changes={changes} emptyText="Nothing changed yet." adjusters={car.damperAdjusters} />
      </section>

      <div className={SAVE_BAR_CLASSES}>
        <FormAlert message={formError} />
        {waiting ? (
          <p role="status" className="text-sm font-semibold">
            Saved on this phone. {reason ? `Waiting to upload (${reason}) — it goes by itself; you can leave this page.` : 'Uploading…'}{' '}
            <Link to={pathTo.car(car.id)} className="text-link underline">
              Back to the car
            </Link>
          </p>
        ) : null}
        <Button type="submit" className="min-h-tap-lg w-full text-lg" disabled={waiting || uploaded} isPending={write.isPending} pendingLabel="Saving…">
          {watched.status === 'failed' ? 'Fix and send again' : 'Save as new setup'}
        </Button>
      </div>
    </form>
  );
}
