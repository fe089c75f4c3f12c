import { useState } from 'react';
import { coldPressureKpa, hotPressureKpa, tyreDimensions, type TyreDimensions } from '@shared/calc/index';
import { formatQuantity, MM_PER_INCH } from '@shared/calc/units.calc';
import { LIMITS } from '@shared/season/limits';
import { SegmentedControl } from '@/components/ui/segmented-control';
import { TextField } from '@/components/ui/text-field';
import { UnitInput } from '@/components/ui/unit-input';
import { unitSymbol } from '@/lib/numbers';
import { useUnits } from '@/lib/units-context';
import { useCars } from '@/features/cars/api/get-cars';
import { formatNumber, formatPrecise, readQuantity, runCalc } from '../utils/calc-fields';
import { CalcHeading, CalculatorCard, CheckTheNumbers, ResultNote, ResultRow, Results } from './calculator-card';

type Direction = 'coldToHot' | 'hotToCold';

/**
 * What a tyre sees in use: −40 °C (a winter morning) to 150 °C (well past a track tyre's working range), and
 * pressures within the limits a setup may hold (common practice; from memory). The gas law still answers
 * outside them, so the card says the numbers look wrong instead of letting a typo pass as a result.
 */
const TYRE_TEMP_C = { min: -40, max: 150 } as const;

/** Reads a size; a size that cannot be read gives the calculation's own message. */
function readSize(size: string): { kind: 'empty' } | { kind: 'ok'; value: TyreDimensions } | { kind: 'error'; message: string } {
  if (size.trim() === '') return { kind: 'empty' };
  try {
    return { kind: 'ok', value: tyreDimensions(size) };
  } catch (error) {
    return { kind: 'error', message: error instanceof Error ? error.message : String(error) };
  }
}

/** Nominal dimensions from a tyre size, and cold ↔ hot pressure at constant volume. */
export function TyreCard() {
  const units = useUnits();
  const { data: cars } = useCars();
  const [size, setSize] = useState('');
  // The sizes on the user's own cars, each once, to fill the field with one tap.
  const carSizes = [...new Map((cars?.items ?? []).filter((c) => c.tyreSize).map((c) => [c.tyreSize!, c.name])).entries()];
  const [direction, setDirection] = useState<Direction>('coldToHot');
  const [pressure, setPressure] = useState('');
  const [fromTemp, setFromTemp] = useState('');
  const [toTemp, setToTemp] = useState('');

  const dims = readSize(size);
  const pressureUnit = unitSymbol('pressure', units);
  const tempUnit = unitSymbol('temperature', units);
  const coldToHot = direction === 'coldToHot';

  // Typical values for the examples in error messages: 200 kPa cold at 20 °C, 230 kPa hot at 60 °C.
  const from = readQuantity(fromTemp, 'temperature', units, coldToHot ? 20 : 60);
  const to = readQuantity(toTemp, 'temperature', units, coldToHot ? 60 : 20);
  const converted = runCalc(
    { p: readQuantity(pressure, 'pressure', units, coldToHot ? 200 : 230), from, to },
    ['p', 'from', 'to'],
    (v) =>
      coldToHot
        ? hotPressureKpa({ coldGaugeKpa: v.p, coldTempC: v.from, hotTempC: v.to })
        : coldPressureKpa({ hotGaugeKpa: v.p, hotTempC: v.from, coldTempC: v.to }),
  );

  const temps = [from, to];
  const implausible =
    converted.status === 'ok' &&
    (temps.some((t) => t.kind === 'value' && (t.si < TYRE_TEMP_C.min || t.si > TYRE_TEMP_C.max)) ||
      converted.value > LIMITS.pressureKpa.max);

  return (
    <CalculatorCard
      title="Tyre size and pressure"
      formula="OD = 25.4·D + 2·W·AR/100, C = π·OD; P₂(abs) = P₁(abs)·T₂/T₁ with absolute pressure and temperature"
      source="ETRTO / Tire and Rim Association conventions (nominal values); OpenStax College Physics §13.3"
      caution="Tyre placard pressures are cold pressures. Stay within the tyre and wheel makers' pressure and load limits."
    >
      <CalcHeading>Size → dimensions</CalcHeading>
      <TextField
        label="Tyre size"
        placeholder="e.g. 245/40R18"
        autoComplete="off"
        spellCheck={false}
        value={size}
        onChange={(e) => setSize(e.target.value)}
        error={dims.kind === 'error' ? dims.message : undefined}
        hint="Width mm / aspect ratio % R rim inches"
      />
      {carSizes.length > 0 ? (
        <div role="group" aria-label="Sizes on your cars" className="flex flex-wrap gap-2">
          {carSizes.map(([carSize, carName]) => (
            <button
              key={carSize}
              type="button"
              aria-pressed={size.trim() === carSize}
              className="min-h-tap rounded-full border border-line-strong px-3 text-sm font-semibold text-link aria-pressed:border-accent aria-pressed:bg-accent-soft"
              onClick={() => setSize(carSize)}
            >
              {carName}: {carSize}
            </button>
          ))}
        </div>
      ) : null}
      <Results label="Nominal tyre dimensions">
        {dims.kind === 'ok' ? (
          <>
            <ResultRow term="Sidewall height (nominal)">{formatQuantity(dims.value.sidewallMm, 'length', units)}</ResultRow>
            <ResultRow term="Overall diameter (nominal)" emphasis>
              {formatQuantity(dims.value.overallDiameterMm, 'length', units)}
            </ResultRow>
            <ResultRow term="Circumference (nominal)">{formatQuantity(dims.value.circumferenceMm, 'length', units)}</ResultRow>
            <ResultRow term="Revolutions per km (nominal)">{formatNumber(dims.value.revsPerKm, 1)}</ResultRow>
            <ResultRow term="Revolutions per mile (nominal)">{formatNumber(dims.value.revsPerMile, 1)}</ResultRow>
          </>
        ) : (
          <ResultNote>Enter a size such as 245/40R18.</ResultNote>
        )}
      </Results>
      <p className="text-sm text-ink-muted">
        Nominal design values. A real tyre differs with its rim, brand, inflation and wear (about{' '}
        {formatQuantity(2 * 8 * (MM_PER_INCH / 32), 'length', units)} less diameter from 10/32 to 2/32 in of tread, 8/32 in off each
        side), and rolls on a smaller circumference under load.
      </p>

      <CalcHeading>Cold and hot pressure</CalcHeading>
      <SegmentedControl<Direction>
        label="Work out"
        options={[
          { value: 'coldToHot', label: 'Hot from cold' },
          { value: 'hotToCold', label: 'Cold from hot' },
        ]}
        value={direction}
        onChange={setDirection}
      />
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
        <UnitInput
          label={coldToHot ? 'Cold pressure' : 'Hot pressure'}
          unit={pressureUnit}
          value={pressure}
          onChange={(e) => setPressure(e.target.value)}
          error={converted.errors.p}
          hint="Gauge pressure"
        />
        <UnitInput
          label={coldToHot ? 'Cold temperature' : 'Hot temperature'}
          unit={tempUnit}
          signed
          value={fromTemp}
          onChange={(e) => setFromTemp(e.target.value)}
          error={converted.errors.from}
        />
        <UnitInput
          label={coldToHot ? 'Hot temperature' : 'Cold temperature'}
          unit={tempUnit}
          signed
          value={toTemp}
          onChange={(e) => setToTemp(e.target.value)}
          error={converted.errors.to}
        />
      </div>
      <Results label="Pressure">
        {converted.status === 'ok' ? (
          <ResultRow term={coldToHot ? 'Hot pressure' : 'Cold pressure'} emphasis>
            {formatPrecise(converted.value, 'pressure', units)}
          </ResultRow>
        ) : null}
        {implausible ? (
          <CheckTheNumbers
            outside="a tyre sees in use"
            limits={`${formatQuantity(TYRE_TEMP_C.min, 'temperature', units)} to ${formatQuantity(TYRE_TEMP_C.max, 'temperature', units)}, up to ${formatQuantity(LIMITS.pressureKpa.max, 'pressure', units)}`}
            before="setting a tyre by this result"
          />
        ) : null}
        {converted.status === 'ok' ? null : converted.status === 'error' && converted.message ? (
          <ResultNote error>{converted.message}</ResultNote>
        ) : (
          <ResultNote>Enter a pressure and both temperatures.</ResultNote>
        )}
      </Results>
      <p className="text-sm text-ink-muted">
        Gauge pressures at constant volume and a standard atmosphere ({units.pressure === 'kPa' ? '101.325 kPa' : formatQuantity(101.325, 'pressure', units)}); real tyres rise a little less as the carcass
        stretches. Placard pressures are cold pressures.
      </p>
    </CalculatorCard>
  );
}
