import { useState } from 'react';
import { CORNERS, type Corner } from '@shared/season/corners';
import { MEASUREMENT_FIELDS, type MeasurementField, type Stage, type WorkOrder, type WorkOrderStage } from '@shared/service/work-order.schema';
import { formatQuantity } from '@shared/calc/units.calc';
import { CORNER_NAMES, CornerGrid } from '@/components/corner-grid/corner-grid';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { UnitInput } from '@/components/ui/unit-input';
import { formatDelta, inputToSi, parseDecimal, toInputText, typeANumber, unitSymbol } from '@/lib/numbers';
import { camberChangeWords } from '@/lib/setup-fields';
import { useUnits } from '@/lib/units-context';
import { usePutMeasurements } from '../api/edit-work-order';
import { attentionMessage, splitErrors, useShowRefused } from '../utils/field-errors';
import { MEASUREMENT_INFO, STAGE_WORDS } from '../utils/measurement-fields';

function Balance({ stage }: { stage: WorkOrderStage }) {
  const units = useUnits();
  const how = [
    stage.driverInCar ? `driver in the car (${formatQuantity(stage.driverWeightKg, 'mass', units)})` : 'no driver in the car',
    stage.fuelLevelPct === null ? 'fuel not noted' : `fuel ${stage.fuelLevelPct} %`,
  ].join(', ');
  return (
    <div className="tabular-figures flex flex-col gap-1 text-sm">
      <p className="text-ink-muted">Measured with {how}.</p>
      {stage.balance ? (
        <p>
          Total {formatQuantity(stage.balance.totalKg, 'mass', units)} · cross {stage.balance.crossPct.toFixed(1)} % · front{' '}
          {stage.balance.frontPct.toFixed(1)} % · left {stage.balance.leftPct.toFixed(1)} %
        </p>
      ) : (
        <p className="text-ink-muted">Cross, front and left % appear once all four corner weights are in.</p>
      )}
    </div>
  );
}

/** A reading and its unit (or a change and its arrow) on one line: each space becomes a no-break space. */
const heldTogether = (text: string) => text.replaceAll(' ', '\u00a0');

/** Before and after side by side, each corner showing after's change from before. */
export function MeasurementsView({ workOrder }: { workOrder: WorkOrder }) {
  const units = useUnits();
  const { before, after } = workOrder.stages;
  if (!before && !after) return <p className="text-ink-muted">No measurements yet.</p>;
  const cell = (corner: Corner, field: MeasurementField) => {
    const info = MEASUREMENT_INFO[field];
    const b = before?.corners[corner][field] ?? null;
    const a = after?.corners[corner][field] ?? null;
    const d = workOrder.diff[corner][field];
    return (
      <div key={field} className="tabular-figures flex flex-wrap justify-between gap-x-2 text-sm">
        <span className="text-ink-muted">{info.label}</span>
        {/* A narrow corner wraps only between whole readings: never inside "122.0 mm" nor before the arrow. */}
        <span>
          {`${heldTogether(formatQuantity(b, info.quantity, units))}\u00a0→ ${heldTogether(formatQuantity(a, info.quantity, units))}`}
          {d !== null ? (
            <span className="font-semibold">
              {' '}
              {/* Camber in the setups' own words ("1.20° more negative"): an arrow down is ambiguous on a negative angle. */}
              {field === 'camberDeg' && a !== null && b !== null ? camberChangeWords(d, [b, a], units) : heldTogether(formatDelta(d, info.quantity, units))}
            </span>
          ) : null}
        </span>
      </div>
    );
  };
  return (
    <div className="flex flex-col gap-3 print:grid print:grid-cols-[3fr_2fr] print:items-start">
      <CornerGrid
        label="Before → after, per corner"
        renderCorner={(corner) => <div className="flex flex-col gap-0.5">{MEASUREMENT_FIELDS.map((f) => cell(corner, f))}</div>}
      />
      <div className="flex flex-col gap-3">
        {(['before', 'after'] as const).map((s) => {
          const stage = workOrder.stages[s];
          return stage ? (
            <div key={s} className="flex flex-col gap-1">
              <h3 className="font-bold">{STAGE_WORDS[s]}</h3>
              <Balance stage={stage} />
            </div>
          ) : null;
        })}
      </div>
    </div>
  );
}

type CornerTexts = Record<Corner, Record<MeasurementField, string>>;

/** Staff type one stage's readings in their own units; they are sent in SI. */
export function MeasurementsForm({ workOrder, stage }: { workOrder: WorkOrder; stage: Stage }) {
  const units = useUnits();
  const current = workOrder.stages[stage];
  const [texts, setTexts] = useState<CornerTexts>(
    () =>
      Object.fromEntries(
        CORNERS.map((c) => [
          c,
          Object.fromEntries(
            MEASUREMENT_FIELDS.map((f) => [f, toInputText(current?.corners[c][f] ?? null, MEASUREMENT_INFO[f].quantity, units)]),
          ),
        ]),
      ) as CornerTexts,
  );
  const [driverInCar, setDriverInCar] = useState(current?.driverInCar ?? false);
  const [driverWeight, setDriverWeight] = useState(toInputText(current?.driverWeightKg ?? null, 'mass', units));
  const [fuel, setFuel] = useState(current?.fuelLevelPct === null || current?.fuelLevelPct === undefined ? '' : String(current.fuelLevelPct));
  const [localErrors, setLocalErrors] = useState<Record<string, string>>({});
  const save = usePutMeasurements(workOrder.id, stage);
  const server = splitErrors(save.error);
  const errorOf = (key: string) => localErrors[key] ?? server.fields[key];
  const { formRef, refused } = useShowRefused();

  const submit = () => {
    const errors: Record<string, string> = {};
    const corners = Object.fromEntries(
      CORNERS.map((c) => [
        c,
        Object.fromEntries(
          MEASUREMENT_FIELDS.map((f) => {
            const si = inputToSi(texts[c][f], MEASUREMENT_INFO[f].quantity, units);
            if (si === 'invalid') errors[`corners.${c}.${f}`] = typeANumber();
            return [f, si === 'invalid' ? null : si];
          }),
        ),
      ]),
    );
    const weight = inputToSi(driverWeight, 'mass', units);
    if (weight === 'invalid') errors.driverWeightKg = typeANumber();
    const fuelParsed = parseDecimal(fuel);
    if (fuelParsed.kind === 'invalid') errors.fuelLevelPct = typeANumber();
    setLocalErrors(errors);
    if (Object.keys(errors).length > 0) {
      refused();
      return;
    }
    save.mutate(
      {
        driverInCar,
        driverWeightKg: weight === 'invalid' ? null : weight,
        fuelLevelPct: fuelParsed.kind === 'number' ? fuelParsed.value : null,
        corners,
      },
      { onError: refused },
    );
  };

  const words = STAGE_WORDS[stage];
  return (
    <form
      ref={formRef}
      aria-label={`${words} measurements`}
      className="flex flex-col gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        submit();
      }}
    >
      <CornerGrid
        label={`${words}: per corner`}
        cornerInvalid={(c) => MEASUREMENT_FIELDS.some((f) => Boolean(errorOf(`corners.${c}.${f}`)))}
        renderCorner={(corner) => (
          <div className="flex flex-col gap-1">
            {MEASUREMENT_FIELDS.map((f) => {
              const info = MEASUREMENT_INFO[f];
              return (
                <UnitInput
                  key={f}
                  label={info.label}
                  // Eight inputs per stage share the short label drawn in each corner; the name read out says which one.
                  aria-label={`${CORNER_NAMES[corner]} ${info.label.toLowerCase()}, ${stage}`}
                  unit={unitSymbol(info.quantity, units)}
                  signed={info.signed}
                  value={texts[corner][f]}
                  error={errorOf(`corners.${corner}.${f}`)}
                  onChange={(e) => {
                    const value = e.target.value;
                    setTexts((t) => ({ ...t, [corner]: { ...t[corner], [f]: value } }));
                  }}
                />
              );
            })}
          </div>
        )}
      />
      <label className="flex min-h-tap items-center gap-2 font-semibold">
        <input type="checkbox" className="size-5" checked={driverInCar} onChange={(e) => setDriverInCar(e.target.checked)} />
        Driver in the car
      </label>
      <div className="grid grid-cols-2 gap-2">
        <UnitInput
          label="Driver weight"
          unit={unitSymbol('mass', units)}
          value={driverWeight}
          error={errorOf('driverWeightKg')}
          onChange={(e) => setDriverWeight(e.target.value)}
        />
        <UnitInput label="Fuel level" unit="%" value={fuel} error={errorOf('fuelLevelPct')} onChange={(e) => setFuel(e.target.value)} />
      </div>
      <FormAlert message={attentionMessage(server.form, Object.keys({ ...server.fields, ...localErrors }).length)} />
      <Button type="submit" isPending={save.isPending} pendingLabel="Saving…" className="self-start">
        Save {words.toLowerCase()} measurements
      </Button>
      {save.isSuccess && !save.isPending ? <p role="status" className="text-sm text-ink-muted">Saved.</p> : null}
    </form>
  );
}
