import { useState } from 'react';
import { camberDeg, toeAngleDeg, toeLengthMm } from '@shared/calc/index';
import { SegmentedControl } from '@/components/ui/segmented-control';
import { UnitInput } from '@/components/ui/unit-input';
import { unitSymbol } from '@/lib/numbers';
import { useUnits } from '@/lib/units-context';
import { formatPrecise, readNumber, readQuantity, runCalc } from '../utils/calc-fields';
import { CalcHeading, CalculatorCard, ResultNote, ResultRow, Results } from './calculator-card';

type Basis = 'rim' | 'tyre';

/** Toe length ↔ angle for one wheel across a stated diameter, and camber from a plumb-line reading. */
export function AlignmentCard() {
  const units = useUnits();
  const [basis, setBasis] = useState<Basis>('rim');
  const [diameter, setDiameter] = useState('');
  const [toeLength, setToeLength] = useState('');
  const [toeAngle, setToeAngle] = useState('');
  const [topInboard, setTopInboard] = useState('');
  const [height, setHeight] = useState('');

  const lengthUnit = unitSymbol('length', units);
  const across = basis === 'rim' ? 'the rim' : 'the tyre';
  // Typical values for the examples in error messages: a 15 in rim, a 24 in tyre.
  const diameterReading = readQuantity(diameter, 'length', units, basis === 'rim' ? 381 : 610);

  const toAngle = runCalc(
    { toe: readQuantity(toeLength, 'length', units, 1.5), d: diameterReading },
    ['toe', 'd'],
    (v) => toeAngleDeg({ toeMm: v.toe, diameterMm: v.d }),
    [['Toe', 'toe'], ['Diameter', 'd']],
  );
  const toLength = runCalc(
    { angle: readNumber(toeAngle, 0.1), d: diameterReading },
    ['angle', 'd'],
    (v) => toeLengthMm({ angleDeg: v.angle, diameterMm: v.d }),
    [['Toe angle', 'angle'], ['Diameter', 'd']],
  );
  const camber = runCalc(
    { dx: readQuantity(topInboard, 'length', units, 6), h: readQuantity(height, 'length', units, 381) },
    ['dx', 'h'],
    (v) => camberDeg({ topInboardMm: v.dx, heightMm: v.h }),
    [['Top inboard', 'dx'], ['Height', 'h']],
  );

  return (
    <CalculatorCard
      title="Toe and camber"
      formula="toe θ = atan(L/D) per wheel, total = left + right; camber = −atan(Δx/h)"
      source="SAE J670 Vehicle Dynamics Terminology (sign conventions); alignment shop guides (x = D·sin θ per side)"
      caution="Alignment is verified by a qualified technician. Support a raised car on stands on firm ground — never work under a car held by a jack alone."
    >
      <CalcHeading>Toe, one wheel</CalcHeading>
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
        <SegmentedControl<Basis>
          label="Measured across"
          options={[
            { value: 'rim', label: 'Rim' },
            { value: 'tyre', label: 'Tyre' },
          ]}
          value={basis}
          onChange={setBasis}
        />
        <UnitInput
          label={basis === 'rim' ? 'Rim diameter' : 'Tyre diameter'}
          unit={lengthUnit}
          value={diameter}
          onChange={(e) => setDiameter(e.target.value)}
          error={toAngle.errors.d ?? toLength.errors.d}
          hint={`The diameter the toe was measured across: ${across}`}
        />
        <UnitInput
          label="Toe length (front minus rear)"
          unit={lengthUnit}
          signed
          value={toeLength}
          onChange={(e) => setToeLength(e.target.value)}
          error={toAngle.errors.toe}
          hint="Toe-in positive"
        />
        <UnitInput
          label="Toe angle"
          unit="°"
          signed
          value={toeAngle}
          onChange={(e) => setToeAngle(e.target.value)}
          error={toLength.errors.angle}
          hint="Toe-in positive"
        />
      </div>
      <Results label="Toe">
        {toAngle.status === 'ok' ? (
          <ResultRow term={`Toe angle, across ${across}`}>{formatPrecise(toAngle.value, 'angle', units)}</ResultRow>
        ) : null}
        {toLength.status === 'ok' ? (
          <ResultRow term={`Toe length, across ${across}`}>{formatPrecise(toLength.value, 'length', units, { extraDecimals: 1 })}</ResultRow>
        ) : null}
        {toAngle.status !== 'ok' && toLength.status !== 'ok' ? (
          <ResultNote>Enter the diameter, then a toe length or a toe angle.</ResultNote>
        ) : null}
      </Results>
      <p className="text-sm text-ink-muted">
        Per wheel. Total toe = left wheel + right wheel. Say which diameter you used (rim or tyre): the same angle is a longer
        length across a tyre.
      </p>

      <CalcHeading>Camber from a plumb line</CalcHeading>
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
        <UnitInput
          label="Top of the wheel inboard by"
          unit={lengthUnit}
          signed
          value={topInboard}
          onChange={(e) => setTopInboard(e.target.value)}
          error={camber.errors.dx}
          hint="How far the top sits inboard of the bottom; negative if outboard"
        />
        <UnitInput
          label="Over a height of"
          unit={lengthUnit}
          value={height}
          onChange={(e) => setHeight(e.target.value)}
          error={camber.errors.h}
          hint="Between the two points measured, e.g. the rim diameter"
        />
      </div>
      <Results label="Camber">
        {camber.status === 'ok' ? (
          <ResultRow term="Camber" emphasis>
            {formatPrecise(camber.value, 'angle', units)}
          </ResultRow>
        ) : (
          <ResultNote>Enter how far the top leans in and the height it was measured over.</ResultNote>
        )}
      </Results>
      <p className="text-sm text-ink-muted">Negative camber: the top of the wheel leans inboard.</p>
    </CalculatorCard>
  );
}
