import { useState } from 'react';
import { cornerWeights, wedgeChange, type CornerValues } from '@shared/calc/index';
import { CORNERS, type Corner } from '@shared/season/corners';
import { CORNER_NAMES, CornerGrid } from '@/components/corner-grid/corner-grid';
import { SelectField } from '@/components/ui/select-field';
import { UnitInput } from '@/components/ui/unit-input';
import { formatQuantity, toDisplay } from '@shared/calc/units.calc';
import { unitSymbol } from '@/lib/numbers';
import { useUnits } from '@/lib/units-context';
import { aboveZero, formatNumber, formatPct, formatPrecise, readQuantity, runCalc, type Reading } from '../utils/calc-fields';
import { CalcHeading, CalculatorCard, CheckTheNumbers, ResultNote, ResultRow, Results } from './calculator-card';

type PerCornerText = Record<Corner, string>;
const EMPTY: PerCornerText = { lf: '', rf: '', lr: '', rr: '' };

const WEIGHT_BLAME = CORNERS.map((c) => [`${CORNER_NAMES[c]} weight`, c] as const);
const RATE_BLAME = CORNERS.map((c) => [`${CORNER_NAMES[c]} wheel rate`, c] as const);

const CORNER_OPTIONS = CORNERS.map((c) => ({ value: c, label: CORNER_NAMES[c] }));

/**
 * What a club car weighs on the scales, driver in and fuel as raced: well under 5000 kg in all and 1500 kg at any
 * one corner, even for a heavy saloon or pickup (common practice; from memory). Readings past these are almost
 * certainly a typo or lb typed as kg, so the card says to check them, and still shows what they give.
 */
const CLUB_CAR_KG = { corner: 1500, total: 5000 } as const;

/** Corner weights → total, front %, left %, cross %; and what raising one corner's perch does to them. */
export function CornerBalanceCard() {
  const units = useUnits();
  const [weights, setWeights] = useState<PerCornerText>(EMPTY);
  const [rates, setRates] = useState<PerCornerText>(EMPTY);
  const [corner, setCorner] = useState<Corner>('lf');
  const [offset, setOffset] = useState('');
  const [trackFront, setTrackFront] = useState('');
  const [trackRear, setTrackRear] = useState('');

  const massUnit = unitSymbol('mass', units);
  const rateUnit = unitSymbol('springRate', units);
  const lengthUnit = unitSymbol('length', units);

  // A corner at 0 or below is no car on four scales: each such corner is marked, before any balance is worked out.
  const weightReadings = Object.fromEntries(
    CORNERS.map((c) => [c, aboveZero(readQuantity(weights[c], 'mass', units, 300), `${CORNER_NAMES[c]} weight`)]),
  ) as Record<Corner, Reading>;
  const balance = runCalc(weightReadings, CORNERS, (v) => cornerWeights(v), WEIGHT_BLAME);
  const implausible =
    balance.status === 'ok' &&
    (CORNERS.some((c) => {
      const w = weightReadings[c];
      return w.kind === 'value' && w.si > CLUB_CAR_KG.corner;
    }) ||
      balance.value.totalKg > CLUB_CAR_KG.total);
  // The limits in the user's mass unit, to the kg or lb: "1500 kg", "3307 lb".
  const massLimit = (kg: number) => `${formatNumber(toDisplay(kg, 'mass', units), 0)} ${massUnit}`;

  const rateReadings = Object.fromEntries(CORNERS.map((c) => [c, readQuantity(rates[c], 'springRate', units, 70)])) as Record<Corner, Reading>;
  const wedge = runCalc(
    { ...rateReadings, offset: readQuantity(offset, 'length', units, 3), tf: readQuantity(trackFront, 'length', units, 1500), tr: readQuantity(trackRear, 'length', units, 1500) },
    [...CORNERS, 'offset'],
    (v) =>
      wedgeChange({
        wheelRatesNPerMm: { lf: v.lf, rf: v.rf, lr: v.lr, rr: v.rr },
        corner,
        wheelOffsetMm: v.offset,
        trackFrontMm: v.tf,
        trackRearMm: v.tr,
      }),
    [...RATE_BLAME, ['Wheel offset', 'offset'], ['Front track', 'tf'], ['Rear track', 'tr']],
  );

  // The cross weight after the perch change, when the scale readings above are complete.
  let crossAfter: number | null = null;
  if (balance.status === 'ok' && wedge.status === 'ok') {
    const w = weightReadings as Record<Corner, { kind: 'value'; si: number }>;
    const after: CornerValues = { lf: w.lf.si + wedge.value.lf, rf: w.rf.si + wedge.value.rf, lr: w.lr.si + wedge.value.lr, rr: w.rr.si + wedge.value.rr };
    try {
      crossAfter = cornerWeights(after).crossPct;
    } catch {
      crossAfter = null;
    }
  }

  return (
    <CalculatorCard
      title="Corner balance and wedge"
      formula="cross % = (LF + RR) / total × 100; perch change X = δ / [(1/k_LF + 1/k_RF) + (t_f/t_r)²·(1/k_LR + 1/k_RR)]"
      source="common practice (Hotchkis on weight distribution; Schroeder, “Understanding Corner Weights”); perch change: rigid-chassis statics, derived and checked numerically"
      caution="Weigh on level pads with the driver in and fuel as raced. Support a raised car on stands on firm ground — never work under a car held by a jack alone. Corner balance is verified by a qualified technician."
    >
      <CornerGrid
        label={`Corner weights (${massUnit})`}
        cornerInvalid={(c) => Boolean(balance.errors[c])}
        renderCorner={(c) => (
          <UnitInput
            label={`${CORNER_NAMES[c]} weight`}
            hideLabel
            unit={massUnit}
            value={weights[c]}
            onChange={(e) => setWeights((prev) => ({ ...prev, [c]: e.target.value }))}
            error={balance.errors[c]}
          />
        )}
      />
      <p className="text-sm text-ink-muted">
        Type each scale&apos;s reading as shown. Corner scales read “lb” as a force: at standard gravity (g_n = 9.806 65 m/s²) it is
        the same number as lb of mass.
      </p>
      <Results label="Corner balance">
        {balance.status === 'ok' ? (
          <>
            <ResultRow term="Total">{formatQuantity(balance.value.totalKg, 'mass', units)}</ResultRow>
            <ResultRow term="Front">{formatPct(balance.value.frontPct)}</ResultRow>
            <ResultRow term="Left">{formatPct(balance.value.leftPct)}</ResultRow>
            <ResultRow term="Cross (LF + RR)" emphasis>
              {formatPct(balance.value.crossPct)}
            </ResultRow>
            <ResultRow term="Other diagonal (RF + LR)">{formatPct(100 - balance.value.crossPct)}</ResultRow>
            {implausible ? (
              <CheckTheNumbers
                outside="a club car weighs"
                limits={`up to ${massLimit(CLUB_CAR_KG.corner)} at a corner, ${massLimit(CLUB_CAR_KG.total)} in all`}
                before="setting the car by this balance"
              />
            ) : null}
          </>
        ) : balance.status === 'error' && balance.message ? (
          <ResultNote error>{balance.message}</ResultNote>
        ) : (
          <ResultNote>Enter all four corner weights to see the balance.</ResultNote>
        )}
      </Results>
      <p className="text-sm">
        Scrubline&apos;s cross is <strong>LF + RR</strong> as a share of the total; the other diagonal (RF + LR, which oval-track
        writing calls “wedge”) is 100 − cross. About 50 % suits a car that turns both ways, weighed as raced.
      </p>

      <CalcHeading>Perch change (wedge)</CalcHeading>
      <CornerGrid
        label={`Wheel rates (${rateUnit})`}
        cornerInvalid={(c) => Boolean(wedge.errors[c])}
        renderCorner={(c) => (
          <UnitInput
            label={`${CORNER_NAMES[c]} wheel rate`}
            hideLabel
            unit={rateUnit}
            value={rates[c]}
            onChange={(e) => setRates((prev) => ({ ...prev, [c]: e.target.value }))}
            error={wedge.errors[c]}
          />
        )}
      />
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
        <SelectField label="Corner whose perch moves" options={CORNER_OPTIONS} value={corner} onChange={(e) => setCorner(e.target.value as Corner)} />
        <UnitInput
          label="Wheel moves by"
          unit={lengthUnit}
          signed
          value={offset}
          onChange={(e) => setOffset(e.target.value)}
          error={wedge.errors.offset}
          hint="Positive: perch raised. A perch moved Δs at the spring moves the wheel Δs ÷ motion ratio."
        />
        <UnitInput
          label="Front track (optional)"
          unit={lengthUnit}
          value={trackFront}
          onChange={(e) => setTrackFront(e.target.value)}
          error={wedge.errors.tf}
        />
        <UnitInput
          label="Rear track (optional)"
          unit={lengthUnit}
          value={trackRear}
          onChange={(e) => setTrackRear(e.target.value)}
          error={wedge.errors.tr}
          hint="Give both tracks, or neither for equal tracks."
        />
      </div>
      <Results label="Perch change">
        {wedge.status === 'ok' ? (
          <>
            <CornerGrid
              label={`Change in corner weight (${massUnit})`}
              renderCorner={(c) => (
                <p className="tabular-figures text-right text-lg font-bold">{formatPrecise(wedge.value[c], 'mass', units, { signed: true })}</p>
              )}
            />
            {crossAfter !== null && balance.status === 'ok' ? (
              <ResultRow term="Cross (LF + RR)">
                {formatPct(balance.value.crossPct)} → {formatPct(crossAfter)}
              </ResultRow>
            ) : (
              <ResultNote>Enter the corner weights above to see the new cross weight.</ResultNote>
            )}
          </>
        ) : wedge.status === 'error' && wedge.message ? (
          <ResultNote error>{wedge.message}</ResultNote>
        ) : (
          <ResultNote>Enter four wheel rates and how far the wheel moves.</ResultNote>
        )}
      </Results>
      <p className="text-sm font-semibold">
        Rigid-chassis approximation: ignores anti-roll bars, tyre stiffness and chassis flex. Re-weigh the car after any change.
      </p>
    </CalculatorCard>
  );
}
