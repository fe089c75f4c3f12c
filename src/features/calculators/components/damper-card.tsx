import { useState } from 'react';
import { formatQuantity } from '@shared/calc/units.calc';
import { bumpTravelAtWheelMm, compressedLengthCheck, droopCheck, STANDARD_GRAVITY } from '@shared/calc/index';
import { UnitInput } from '@/components/ui/unit-input';
import { toInputText, unitSymbol } from '@/lib/numbers';
import { useUnits } from '@/lib/units-context';
import { formatPrecise, readNumber, readQuantity, runCalc } from '../utils/calc-fields';
import { CalcHeading, CalculatorCard, ResultNote, ResultRow, Results } from './calculator-card';

/** The tolerance compressedLengthCheck uses when none is given (common practice: about 13–16 mm shorter at most). */
const DEFAULT_TOLERANCE_MM = 13;

/** Whether the spring stays seated at full droop, the bump travel left, and an adjustable damper's compressed length. */
export function DamperCard() {
  const units = useUnits();
  const [load, setLoad] = useState('');
  const [springMr, setSpringMr] = useState('');
  const [springRate, setSpringRate] = useState('');
  const [wheelDroop, setWheelDroop] = useState('');
  const [stroke, setStroke] = useState('');
  const [damperDroop, setDamperDroop] = useState('');
  const [bumpStop, setBumpStop] = useState('');
  const [damperMr, setDamperMr] = useState('');
  const [compressed, setCompressed] = useState('');
  const [reference, setReference] = useState('');
  const [tolerance, setTolerance] = useState('');

  const lengthUnit = unitSymbol('length', units);
  const massUnit = unitSymbol('mass', units);
  const rateUnit = unitSymbol('springRate', units);

  const droop = runCalc(
    {
      load: readQuantity(load, 'mass', units, 300),
      mr: readNumber(springMr, 0.8),
      k: readQuantity(springRate, 'springRate', units, 70),
      droop: readQuantity(wheelDroop, 'length', units, 75),
    },
    ['load', 'mr', 'k', 'droop'],
    // The load is typed as a mass (a corner-scale reading); the spring carries its weight: × g_n.
    (v) => droopCheck({ wheelLoadN: v.load * STANDARD_GRAVITY, motionRatio: v.mr, springRateNPerMm: v.k, wheelDroopMm: v.droop }),
    [['Wheel load', 'load'], ['Motion ratio', 'mr'], ['Spring rate', 'k'], ['Wheel droop', 'droop']],
  );

  const bump = runCalc(
    {
      stroke: readQuantity(stroke, 'length', units, 100),
      droop: readQuantity(damperDroop, 'length', units, 50),
      stop: readQuantity(bumpStop, 'length', units, 15),
      mr: readNumber(damperMr, 0.8),
    },
    ['stroke', 'droop', 'mr'],
    (v) => bumpTravelAtWheelMm({ strokeMm: v.stroke, droopAtDamperMm: v.droop, bumpStopMm: v.stop, motionRatio: v.mr }),
    [['Stroke', 'stroke'], ['Droop at the damper', 'droop'], ['Bump stop', 'stop'], ['Motion ratio', 'mr']],
  );

  const length = runCalc(
    {
      compressed: readQuantity(compressed, 'length', units, 350),
      reference: readQuantity(reference, 'length', units, 350),
      tolerance: readQuantity(tolerance, 'length', units, 2),
    },
    ['compressed', 'reference'],
    (v) => compressedLengthCheck({ compressedLengthMm: v.compressed, referenceLengthMm: v.reference, toleranceMm: v.tolerance }),
    [['Compressed length', 'compressed'], ['Reference length', 'reference'], ['Tolerance', 'tolerance']],
  );
  const toleranceMm = length.status === 'ok' && tolerance.trim() !== '' ? null : DEFAULT_TOLERANCE_MM;

  return (
    <CalculatorCard
      title="Damper length and droop"
      formula="x_s = F/(MR·k_s) against d_s = d_wheel·MR; bump at the wheel = (stroke − droop − bump stop)/MR"
      source="common practice (spring seating, damper travel and compressed length)"
      caution="Check clearances with the spring removed and the suspension compressed, with the car on stands on firm ground — never under a car on a jack alone. Compress coil springs only with a proper spring compressor."
    >
      <CalcHeading>Spring seated at full droop?</CalcHeading>
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
        <UnitInput label="Load on the wheel" unit={massUnit} value={load} onChange={(e) => setLoad(e.target.value)} error={droop.errors.load} hint="The corner weight at ride height" />
        <UnitInput label="Spring motion ratio" unit="ratio" value={springMr} onChange={(e) => setSpringMr(e.target.value)} error={droop.errors.mr} hint="Spring travel ÷ wheel travel" />
        <UnitInput label="Main spring rate" unit={rateUnit} value={springRate} onChange={(e) => setSpringRate(e.target.value)} error={droop.errors.k} />
        <UnitInput label="Wheel droop from ride height" unit={lengthUnit} value={wheelDroop} onChange={(e) => setWheelDroop(e.target.value)} error={droop.errors.droop} />
      </div>
      <Results label="Droop check">
        {droop.status === 'ok' ? (
          <>
            <ResultRow term="Spring compressed at ride height">{formatPrecise(droop.value.staticCompressionMm, 'length', units)}</ResultRow>
            <ResultRow term="Spring extends to full droop">{formatPrecise(droop.value.droopAtSpringMm, 'length', units)}</ResultRow>
            {droop.value.seated ? (
              <ResultRow term="Seated at full droop" emphasis>
                Yes, {formatPrecise(droop.value.staticCompressionMm - droop.value.droopAtSpringMm, 'length', units)} of compression to spare
              </ResultRow>
            ) : (
              <>
                <ResultRow term="Seated at full droop" emphasis>
                  No: short by {formatPrecise(droop.value.shortfallMm, 'length', units)}
                </ResultRow>
                <ResultNote>
                  A helper spring must make up {formatPrecise(droop.value.shortfallMm, 'length', units)} of travel at the spring, or
                  droop must be limited.
                </ResultNote>
              </>
            )}
          </>
        ) : droop.status === 'error' && droop.message ? (
          <ResultNote error>{droop.message}</ResultNote>
        ) : (
          <ResultNote>Enter the load, motion ratio, spring rate and droop.</ResultNote>
        )}
      </Results>

      <CalcHeading>Bump travel at the wheel</CalcHeading>
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
        <UnitInput label="Damper stroke" unit={lengthUnit} value={stroke} onChange={(e) => setStroke(e.target.value)} error={bump.errors.stroke} />
        <UnitInput
          label="Droop at the damper"
          unit={lengthUnit}
          value={damperDroop}
          onChange={(e) => setDamperDroop(e.target.value)}
          error={bump.errors.droop}
          hint="Shaft extension from ride height to full droop"
        />
        <UnitInput
          label="Bump stop length (optional)"
          unit={lengthUnit}
          value={bumpStop}
          onChange={(e) => setBumpStop(e.target.value)}
          error={bump.errors.stop}
          hint="Its free length"
        />
        <UnitInput label="Damper motion ratio" unit="ratio" value={damperMr} onChange={(e) => setDamperMr(e.target.value)} error={bump.errors.mr} hint="Damper travel ÷ wheel travel" />
      </div>
      <Results label="Bump travel">
        {bump.status === 'ok' ? (
          <ResultRow term={bumpStop.trim() ? 'Bump travel at the wheel' : 'Bump travel at the wheel (before the bump stop)'} emphasis>
            {formatPrecise(bump.value, 'length', units)}
          </ResultRow>
        ) : bump.status === 'error' && bump.message ? (
          <ResultNote error>{bump.message}</ResultNote>
        ) : (
          <ResultNote>Enter the stroke, the droop at the damper and the motion ratio.</ResultNote>
        )}
      </Results>

      <CalcHeading>Compressed length against the original</CalcHeading>
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
        <UnitInput label="Compressed length" unit={lengthUnit} value={compressed} onChange={(e) => setCompressed(e.target.value)} error={length.errors.compressed} />
        <UnitInput
          label="Original compressed length"
          unit={lengthUnit}
          value={reference}
          onChange={(e) => setReference(e.target.value)}
          error={length.errors.reference}
          hint="The original equipment damper's"
        />
        <UnitInput
          label="Accept up to this much shorter"
          unit={lengthUnit}
          value={tolerance}
          onChange={(e) => setTolerance(e.target.value)}
          error={length.errors.tolerance}
          placeholder={toInputText(DEFAULT_TOLERANCE_MM, 'length', units)}
          hint={`Blank: about ${formatQuantity(DEFAULT_TOLERANCE_MM, 'length', units)} (common practice: ${formatQuantity(13, 'length', units)} to ${formatQuantity(16, 'length', units)} at most)`}
        />
      </div>
      <Results label="Compressed length">
        {length.status === 'ok' ? (
          <>
            <ResultRow term="Against the original">
              {formatPrecise(length.value.differenceMm, 'length', units, { signed: true })}
              {length.value.differenceMm < 0 ? ' (shorter)' : length.value.differenceMm > 0 ? ' (longer)' : ''}
            </ResultRow>
            <ResultRow term="Within common practice" emphasis>
              {length.value.withinTolerance
                ? 'Yes'
                : length.value.differenceMm > 0
                  ? 'No: longer than the original, so the damper would bottom before the original stop'
                  : 'No: shorter than accepted, so the wheel can travel into the body'}
            </ResultRow>
            {toleranceMm !== null ? <ResultNote>Using {formatPrecise(toleranceMm, 'length', units)} as the most it may be shorter.</ResultNote> : null}
          </>
        ) : length.status === 'error' && length.message ? (
          <ResultNote error>{length.message}</ResultNote>
        ) : (
          <ResultNote>Enter both compressed lengths.</ResultNote>
        )}
      </Results>
    </CalculatorCard>
  );
}
