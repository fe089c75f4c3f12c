import { useState } from 'react';
import { rideFrequencyHz, wheelRateForFrequencyNPerMm, wheelRateNPerMm } from '@shared/calc/index';
import { UnitInput } from '@/components/ui/unit-input';
import { unitSymbol } from '@/lib/numbers';
import { useUnits } from '@/lib/units-context';
import { formatNumber, formatPrecise, knownValue, readNumber, readQuantity, runCalc } from '../utils/calc-fields';
import { CalcHeading, CalculatorCard, ResultNote, ResultRow, Results } from './calculator-card';

/** Wheel rate from the spring, ride frequency from the wheel rate and the sprung corner mass, and the way back. */
export function SpringsCard() {
  const units = useUnits();
  const [spring, setSpring] = useState('');
  const [motionRatio, setMotionRatio] = useState('');
  const [angle, setAngle] = useState('');
  const [wheelRateText, setWheelRateText] = useState('');
  const [mass, setMass] = useState('');
  const [tyreRate, setTyreRate] = useState('');
  const [target, setTarget] = useState('');

  const rateUnit = unitSymbol('springRate', units);
  const massUnit = unitSymbol('mass', units);

  const wheel = runCalc(
    { spring: readQuantity(spring, 'springRate', units, 70), mr: readNumber(motionRatio, 0.8), angle: readNumber(angle, 10) },
    ['spring', 'mr'],
    (v) => wheelRateNPerMm({ springRateNPerMm: v.spring, motionRatio: v.mr, springAngleDeg: v.angle }),
    [['Spring rate', 'spring'], ['Motion ratio', 'mr'], ['Spring angle', 'angle']],
  );

  // A wheel rate typed here wins; left blank, the one worked out above is used.
  const typedWheelRate = readQuantity(wheelRateText, 'springRate', units, 45);
  const usesComputed = typedWheelRate.kind === 'empty' && wheel.status === 'ok';
  const frequency = runCalc(
    {
      wr: usesComputed ? knownValue(wheel.value) : typedWheelRate,
      mass: readQuantity(mass, 'mass', units, 300),
      tyre: readQuantity(tyreRate, 'springRate', units, 250),
    },
    ['wr', 'mass'],
    (v) => rideFrequencyHz({ wheelRateNPerMm: v.wr, sprungMassKg: v.mass, tyreRateNPerMm: v.tyre }),
    [['Wheel rate', 'wr'], ['Sprung mass', 'mass'], ['Tyre rate', 'tyre']],
  );

  const inverse = runCalc(
    { f: readNumber(target, 2), mass: readQuantity(mass, 'mass', units, 300), tyre: readQuantity(tyreRate, 'springRate', units, 250) },
    ['f', 'mass'],
    (v) => wheelRateForFrequencyNPerMm({ frequencyHz: v.f, sprungMassKg: v.mass, tyreRateNPerMm: v.tyre }),
    [['Frequency', 'f'], ["That frequency needs", 'f'], ['Tyre rate', 'tyre']],
  );
  // The spring that gives that wheel rate at the motion ratio and angle above: the wheel rate of a 1 N/mm spring
  // is the installation's factor MR²·cos²θ.
  const factor = runCalc({ mr: readNumber(motionRatio, 0.8), angle: readNumber(angle, 10) }, ['mr'], (v) =>
    wheelRateNPerMm({ springRateNPerMm: 1, motionRatio: v.mr, springAngleDeg: v.angle }),
  );

  const massError = frequency.errors.mass ?? inverse.errors.mass;
  const tyreError = frequency.errors.tyre ?? inverse.errors.tyre;

  return (
    <CalculatorCard
      title="Springs"
      formula="k_w = k·MR²·cos²θ; f = (1/2π)·√(k/m), k_ride = k_w·k_t/(k_w + k_t)"
      source="Barton & Fieldhouse, Automotive Chassis Engineering (2018) §3.9 eqs 3.29–3.33; Mark Ortiz, Chassis Newsletter Jan 2002"
      caution="Compress coil springs only with a proper spring compressor. Support a raised car on stands on firm ground — never work under a car held by a jack alone."
    >
      <CalcHeading>Wheel rate</CalcHeading>
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
        <UnitInput label="Spring rate" unit={rateUnit} value={spring} onChange={(e) => setSpring(e.target.value)} error={wheel.errors.spring} />
        <UnitInput
          label="Motion ratio"
          unit="ratio"
          value={motionRatio}
          onChange={(e) => setMotionRatio(e.target.value)}
          error={wheel.errors.mr ?? factor.errors.mr}
          hint="Spring travel ÷ wheel travel"
        />
        <UnitInput
          label="Spring angle (optional)"
          unit="°"
          signed
          value={angle}
          onChange={(e) => setAngle(e.target.value)}
          error={wheel.errors.angle}
          hint="From the path of its mount; 0 if MR was measured along the spring"
        />
      </div>
      <Results label="Wheel rate">
        {wheel.status === 'ok' ? (
          <ResultRow term="Wheel rate" emphasis>
            {formatPrecise(wheel.value, 'springRate', units)}
          </ResultRow>
        ) : wheel.status === 'error' && wheel.message ? (
          <ResultNote error>{wheel.message}</ResultNote>
        ) : (
          <ResultNote>Enter the spring rate and motion ratio.</ResultNote>
        )}
      </Results>

      <CalcHeading>Ride frequency</CalcHeading>
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
        <UnitInput
          label="Wheel rate (optional)"
          unit={rateUnit}
          value={wheelRateText}
          onChange={(e) => setWheelRateText(e.target.value)}
          error={frequency.errors.wr}
          hint={wheel.status === 'ok' ? `Blank: ${formatPrecise(wheel.value, 'springRate', units)} from above` : 'Blank: the wheel rate above'}
        />
        <UnitInput
          label="Sprung corner mass"
          unit={massUnit}
          value={mass}
          onChange={(e) => setMass(e.target.value)}
          error={massError}
          hint="The corner's weight less its unsprung parts"
        />
        <UnitInput
          label="Tyre rate (optional)"
          unit={rateUnit}
          value={tyreRate}
          onChange={(e) => setTyreRate(e.target.value)}
          error={tyreError}
          hint="Vertical stiffness of the tyre, in series"
        />
      </div>
      <Results label="Ride frequency">
        {frequency.status === 'ok' ? (
          <ResultRow term="Ride frequency" emphasis>
            {formatNumber(frequency.value, 2)} Hz
          </ResultRow>
        ) : frequency.status === 'error' && frequency.message ? (
          <ResultNote error>{frequency.message}</ResultNote>
        ) : (
          <ResultNote>Enter a wheel rate (or work one out above) and the sprung corner mass.</ResultNote>
        )}
      </Results>

      <CalcHeading>Wheel rate for a frequency</CalcHeading>
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
        <UnitInput label="Target frequency" unit="Hz" value={target} onChange={(e) => setTarget(e.target.value)} error={inverse.errors.f} hint="Uses the sprung mass and tyre rate above" />
      </div>
      <Results label="Wheel rate for a frequency">
        {inverse.status === 'ok' ? (
          <>
            <ResultRow term="Wheel rate needed" emphasis>
              {formatPrecise(inverse.value, 'springRate', units)}
            </ResultRow>
            {factor.status === 'ok' && factor.value > 0 ? (
              <ResultRow term="Spring rate at the motion ratio above">{formatPrecise(inverse.value / factor.value, 'springRate', units)}</ResultRow>
            ) : null}
          </>
        ) : inverse.status === 'error' && inverse.message ? (
          <ResultNote error>{inverse.message}</ResultNote>
        ) : (
          <ResultNote>Enter a target frequency and the sprung corner mass.</ResultNote>
        )}
      </Results>
      <p className="text-sm text-ink-muted">
        Typical ride frequencies, as guidance only: road cars about 1–1.5 Hz (Audi Self-Study Programme 242, p. 9); race cars
        without aero about 1.5–2.5 Hz (a widely repeated table).
      </p>
    </CalculatorCard>
  );
}
