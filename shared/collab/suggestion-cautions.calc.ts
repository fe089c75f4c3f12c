/**
 * Cautions on a shop's suggested setup changes. `season/limits.ts` refuses what can only be a typo; a value inside
 * those limits can still be far from what a road-registered car on street or track tyres runs (camber −7°, 15 mm of
 * toe per wheel, 70 kPa cold), or a step far larger than a usual one (80 kPa of pressure, a spring twice as stiff,
 * 60 mm lower, all in one go). These warn; they never refuse: a dedicated car may mean it.
 *
 * The thresholds are facts of the trade, kept wide so that an ordinary setup never trips them. None comes from a
 * single published table: each says whether it is common practice or recalled from memory.
 */
import { formatQuantity, type Quantity, type UnitPreferences } from '../calc/units.calc';
import { CORNERS, type Corner, type PerCorner } from '../season/corners';
import { LIMITS } from '../season/limits';
import type { SetupCorner, SetupCornerField } from '../season/setup.schema';
import type { SuggestionChange } from './suggestion.schema';

export const CAUTION_THRESHOLDS = {
  /**
   * Static camber, degrees. Road cars leave the factory at about 0° to −2°; street cars used on track and in autocross
   * commonly run −2° to −3.5° at the front, and about −4° is where street and track-day tyres stop gaining from more
   * (common practice). Beyond −5° the inner shoulders wear fast and braking in a straight line suffers.
   */
  camberMostNegativeDeg: -5,
  /** Positive camber beyond about +1° is outside road cars' factory ranges (from memory) and wears the outer shoulders. */
  camberMostPositiveDeg: 1,
  /**
   * Toe per wheel, mm, either way. Factory figures are a millimetre or two per wheel and race alignments seldom go past
   * about 3 mm of toe-out per wheel (common practice); more scrubs the tread (feathered ribs) and heats the tyres.
   */
  toePerWheelMm: 5,
  /** Caster, degrees: road cars run about +3° to +10° (from memory); below 0° the steering no longer centres itself. */
  casterLeastDeg: 0,
  casterMostDeg: 12,
  /**
   * Cold pressure, kPa. Street and track-day tyres on road cars are set at about 180–260 kPa cold (26–38 psi,
   * common practice; placard figures are cold pressures). Below 140 kPa (≈ 20 psi) a tyre can overheat its sidewalls
   * or come off the bead in a hard corner; above 310 kPa (≈ 45 psi) is at or past the maximum moulded on many
   * passenger tyres' sidewalls (from memory: 300 kPa/44 psi or 350 kPa/51 psi).
   */
  coldPressureLowestKpa: 140,
  coldPressureHighestKpa: 310,
  /**
   * One change of cold pressure, kPa. Usual steps are 5–20 kPa (1–3 psi, common practice); more than 50 kPa (≈ 7 psi)
   * at once is more often a hot pressure, or psi and kPa mixed up, than a setup change.
   */
  pressureStepKpa: 50,
  /**
   * One change of spring rate, as the ratio of the stiffer to the softer spring. Ride frequency goes with the square
   * root of the rate (f = √(k/m)/2π), so 1.75 times the rate raises it by about a third: from a road car's 1.5 Hz to
   * a race car's 2 Hz (typical ranges: road cars ≈ 1–1.5 Hz, non-aero race cars ≈ 1.5–2.5 Hz; common practice).
   * A spring twice as stiff, or half as stiff, in one step changes ride height, balance and corner weights at once.
   */
  springRateRatio: 1.75,
  /**
   * One change of ride height, mm. Usual steps are 5–10 mm; fitting coilovers may lower a car 25–50 mm (common
   * practice). More than 50 mm at once risks tyres touching the body, bump stops and bottoming out.
   */
  rideHeightStepMm: 50,
} as const;

/** Which threshold a caution passes. */
export type SuggestionCautionRule =
  | 'camber-negative'
  | 'camber-positive'
  | 'toe'
  | 'caster-low'
  | 'caster-high'
  | 'pressure-low'
  | 'pressure-high'
  | 'pressure-step'
  | 'spring-step'
  | 'ride-height-step';

/** One unusual value (or step) on one or more corners, SI units. */
export interface SuggestionCaution {
  rule: SuggestionCautionRule;
  field: SetupCornerField;
  /** The corners it applies to, in grid order (LF, RF, LR, RR). */
  corners: Corner[];
  /** The value on the car now, when known. */
  from: number | null;
  /** The value after the changes, when known. */
  to: number | null;
  /** to − from over all the changes together, when known (a change by an amount is known without the value). */
  change: number | null;
  /** The threshold passed: a value, a step, or for springs the ratio of stiffer to softer. */
  limit: number;
}

/** A little room for values typed in another unit and converted (45.0 psi is 310.26 kPa; 310 kPa is not past 310). */
const EPSILON = 1e-9;
const past = (value: number, limit: number) => value > limit + EPSILON;
const below = (value: number, limit: number) => value < limit - EPSILON;

interface CornerResult {
  field: SetupCornerField;
  corner: Corner;
  from: number | null;
  to: number | null;
  change: number | null;
}

/** Every changed field on every corner, from the value on the car now to where all the changes leave it. */
function cornerResults(changes: readonly SuggestionChange[], current: PerCorner<SetupCorner> | null | undefined): CornerResult[] {
  const results = new Map<string, CornerResult & { deltas: number; setTo: boolean }>();
  for (const change of changes) {
    for (const corner of change.corners) {
      const key = `${change.field}.${corner}`;
      const start = current?.[corner]?.[change.field] ?? null;
      const r = results.get(key) ?? { field: change.field, corner, from: start, to: start, change: null, deltas: 0, setTo: false };
      if (change.value !== undefined) {
        r.to = change.value;
        r.setTo = true;
      } else {
        r.to = r.to === null ? null : r.to + (change.delta ?? 0);
        r.deltas += change.delta ?? 0;
      }
      results.set(key, r);
    }
  }
  // The step is known from the two values, or, with no value now, from the changes by an amount when nothing was set.
  return [...results.values()].map(({ field, corner, from, to, deltas, setTo }) => ({
    field,
    corner,
    from,
    to,
    change: from !== null && to !== null ? to - from : setTo ? null : deltas,
  }));
}

/** The limits a snapshot may hold (season/limits.ts): a value past them is refused as a typo, not cautioned. */
const HELD: Partial<Record<SetupCornerField, { min: number; max: number }>> = {
  camberDeg: LIMITS.camberDeg,
  toeMm: LIMITS.toeMm,
  casterDeg: LIMITS.casterDeg,
  coldPressureKpa: LIMITS.pressureKpa,
  springRateNPerMm: LIMITS.springRateNPerMm,
  rideHeightMm: LIMITS.rideHeightMm,
};
const refused = ({ field, to }: CornerResult) => {
  const held = HELD[field];
  return held !== undefined && to !== null && (to < held.min || to > held.max);
};

type Check = (r: CornerResult) => { rule: SuggestionCautionRule; limit: number } | null;

const T = CAUTION_THRESHOLDS;
const CHECKS: Partial<Record<SetupCornerField, Check[]>> = {
  camberDeg: [
    ({ to }) => (to !== null && below(to, T.camberMostNegativeDeg) ? { rule: 'camber-negative', limit: T.camberMostNegativeDeg } : null),
    ({ to }) => (to !== null && past(to, T.camberMostPositiveDeg) ? { rule: 'camber-positive', limit: T.camberMostPositiveDeg } : null),
  ],
  toeMm: [({ to }) => (to !== null && past(Math.abs(to), T.toePerWheelMm) ? { rule: 'toe', limit: T.toePerWheelMm } : null)],
  casterDeg: [
    ({ to }) => (to !== null && below(to, T.casterLeastDeg) ? { rule: 'caster-low', limit: T.casterLeastDeg } : null),
    ({ to }) => (to !== null && past(to, T.casterMostDeg) ? { rule: 'caster-high', limit: T.casterMostDeg } : null),
  ],
  coldPressureKpa: [
    ({ to }) => (to !== null && below(to, T.coldPressureLowestKpa) ? { rule: 'pressure-low', limit: T.coldPressureLowestKpa } : null),
    ({ to }) => (to !== null && past(to, T.coldPressureHighestKpa) ? { rule: 'pressure-high', limit: T.coldPressureHighestKpa } : null),
    ({ change }) => (change !== null && past(Math.abs(change), T.pressureStepKpa) ? { rule: 'pressure-step', limit: T.pressureStepKpa } : null),
  ],
  springRateNPerMm: [
    ({ from, to }) =>
      from !== null && to !== null && from > 0 && to > 0 && past(Math.max(to / from, from / to), T.springRateRatio)
        ? { rule: 'spring-step', limit: T.springRateRatio }
        : null,
  ],
  rideHeightMm: [
    ({ change }) => (change !== null && past(Math.abs(change), T.rideHeightStepMm) ? { rule: 'ride-height-step', limit: T.rideHeightStepMm } : null),
  ],
};

const RULE_ORDER: readonly SuggestionCautionRule[] = [
  'camber-negative', 'camber-positive', 'toe', 'caster-low', 'caster-high',
  'pressure-low', 'pressure-high', 'pressure-step', 'spring-step', 'ride-height-step',
];

/** The rules about a step from the value now, whose words give where it starts. */
const STEP_RULES: ReadonlySet<SuggestionCautionRule> = new Set(['pressure-step', 'spring-step', 'ride-height-step']);

/** Rounded for grouping, so 310.2637… typed twice lands in one group. */
const groupKey = (n: number | null) => (n === null ? '-' : n.toFixed(6));

/**
 * The cautions for a suggestion's changes, worked against the values on the car now (`current`: the setup the changes
 * apply to, or null when unknown). Several changes to the same value on a corner count as one step, from the value now
 * to where the last leaves it. Corners with the same finding and the same numbers share one caution. A value past the
 * limits a setup may hold has none: it is refused as a typo.
 */
export function suggestionCautions(changes: readonly SuggestionChange[], current: PerCorner<SetupCorner> | null | undefined): SuggestionCaution[] {
  const found = new Map<string, SuggestionCaution>();
  for (const r of cornerResults(changes, current)) {
    if (refused(r)) continue;
    for (const check of CHECKS[r.field] ?? []) {
      const hit = check(r);
      if (!hit) continue;
      // A value's caution names only the value, so corners reaching it from different values share one; a step's
      // caution names where it starts and ends.
      const key = (STEP_RULES.has(hit.rule) ? [hit.rule, groupKey(r.from), groupKey(r.to), groupKey(r.change)] : [hit.rule, groupKey(r.to)]).join('|');
      const existing = found.get(key);
      if (existing) existing.corners.push(r.corner);
      else found.set(key, { ...hit, field: r.field, corners: [r.corner], from: r.from, to: r.to, change: r.change });
    }
  }
  return [...found.values()]
    .map((c) => ({ ...c, corners: CORNERS.filter((corner) => c.corners.includes(corner)) }))
    .sort((a, b) => RULE_ORDER.indexOf(a.rule) - RULE_ORDER.indexOf(b.rule) || CORNERS.indexOf(a.corners[0]!) - CORNERS.indexOf(b.corners[0]!));
}

const PAIRS: readonly { words: string; corners: readonly Corner[] }[] = [
  { words: 'Front pair', corners: ['lf', 'rf'] },
  { words: 'Rear pair', corners: ['lr', 'rr'] },
  { words: 'All four', corners: CORNERS },
];

/** "Front pair", "Rear pair", "All four", or the corners by name: "LF + RR". */
export function cornersInWords(corners: readonly Corner[]): string {
  const pair = PAIRS.find((p) => p.corners.length === corners.length && p.corners.every((c) => corners.includes(c)));
  if (pair) return pair.words;
  return CORNERS.filter((c) => corners.includes(c))
    .map((c) => c.toUpperCase())
    .join(' + ');
}

const QUANTITY: Partial<Record<SetupCornerField, Quantity>> = {
  camberDeg: 'angle',
  toeMm: 'length',
  casterDeg: 'angle',
  coldPressureKpa: 'pressure',
  springRateNPerMm: 'springRate',
  rideHeightMm: 'length',
};

/** A signed value with its sign always shown: "+1.50°", "−7.00°". */
const signed = (text: string, value: number) => (value > 0 ? `+${text}` : text);

/**
 * One caution in plain words, in the user's units: where, what, the value, and why it is unusual.
 * "Front pair camber −7.00°: more negative than −5.00°, beyond what road cars on street or track tyres run; the
 * inner shoulders wear fast and the car brakes less well in a straight line."
 */
export function cautionWords(caution: SuggestionCaution, units: UnitPreferences): string {
  const quantity = QUANTITY[caution.field] ?? 'length';
  const q = (si: number) => formatQuantity(si, quantity, units);
  const where = cornersInWords(caution.corners);
  const { from, to, change, limit } = caution;
  const fromTo = from !== null && to !== null ? ` (${q(from)} → ${q(to)})` : '';
  switch (caution.rule) {
    case 'camber-negative':
      return `${where} camber ${q(to!)}: more negative than ${q(limit)}, beyond what road cars on street or track tyres run; the inner shoulders wear fast and the car brakes less well in a straight line.`;
    case 'camber-positive':
      return `${where} camber ${signed(q(to!), to!)}: more positive than ${signed(q(limit), limit)}, outside road cars’ usual range; the outer shoulders wear fast.`;
    case 'toe':
      return `${where} toe-${to! > 0 ? 'in' : 'out'} ${q(Math.abs(to!))} per wheel: more than ${q(limit)} either way, far more than road cars run; this much scrubs and heats the tyres and makes the car wander.`;
    case 'caster-low':
      return `${where} caster ${q(to!)}: below ${q(limit)}; with negative caster the steering no longer centres itself.`;
    case 'caster-high':
      return `${where} caster ${q(to!)}: more than ${q(limit)}, past what road cars usually run; the steering gets heavy and camber changes a lot with lock.`;
    case 'pressure-low':
      return `${where} cold pressure ${q(to!)}: below ${q(limit)}; a street or track tyre this soft can overheat its sidewalls or come off the bead.`;
    case 'pressure-high':
      return `${where} cold pressure ${q(to!)}: above ${q(limit)}, at or past the maximum on many street tyres’ sidewalls; the tyre grips on less rubber.`;
    case 'pressure-step':
      return `${where} cold pressure ${change! < 0 ? 'down' : 'up'} ${q(Math.abs(change!))} at once${fromTo}: more than ${q(limit)}, where a usual step is a few; check it is a cold pressure, in the unit meant.`;
    case 'spring-step': {
      const ratio = Math.max(to! / from!, from! / to!);
      return `${where} spring rate ${q(from!)} → ${q(to!)} at once: ${to! > from! ? `${ratio.toFixed(2)} times as stiff` : `${ratio.toFixed(2)} times as soft`}, more than ${limit} times either way; ride height, balance and corner weights all move with it.`;
    }
    case 'ride-height-step':
      return `${where} ride height ${change! < 0 ? 'lowered' : 'raised'} ${q(Math.abs(change!))} at once${fromTo}: more than ${q(limit)}; check tyre-to-body clearance, bump travel and ground clearance.`;
  }
}
