import type { BoardAxleWear, BoardCar, BoardResult } from '@shared/collab/team.schema';
import { formatQuantity, type UnitPreferences } from '@shared/calc/units.calc';
import { formatRunTime } from '@shared/season/run-time';
import { formatShortDay } from '@/lib/dates';
import { formatPercent, toInputText } from '@/lib/numbers';

/** A class factor as entered: at least three decimals ("0.850", "0.853"), and the fourth when it has one ("0.8535"). */
export function formatFactor(factor: number): string {
  const decimals = String(factor).split('.')[1]?.length ?? 0;
  return decimals <= 3 ? factor.toFixed(3) : String(factor);
}

/** A time on the board to the thousandth ("45.678", "1:05.432"), or "—" when there is none. */
export function boardTime(seconds: number | null): string {
  return seconds === null ? '—' : formatRunTime(seconds);
}

const runsWord = (n: number) => `${n} ${n === 1 ? 'run' : 'runs'}`;

/**
 * A day that ended without a time, in the trade's words: "DNF (2 runs)", "Off course (1 run)", or
 * "No time: 1 DNF, 1 off course". Null when the day has a time, or no runs at all.
 */
export function noTimeWords(result: Pick<BoardResult, 'bestAdjustedSec' | 'runs'>): string | null {
  const { finished, dnf, offCourse } = result.runs;
  if (result.bestAdjustedSec !== null || finished > 0 || dnf + offCourse === 0) return null;
  if (offCourse === 0) return `DNF (${runsWord(dnf)})`;
  if (dnf === 0) return `Off course (${runsWord(offCourse)})`;
  return `No time: ${dnf} DNF, ${offCourse} off course`;
}

/** The cones on the run of a best raw time, added to it in words ("+1 cone"); null for a clean run. */
/**
 * The day's quickest clock time and the cones of the run that set it, which need not be the run of the best adjusted
 * time: "Best raw 46.204 s (that run +2 cones)", so nobody adds the cones to it and expects the adjusted time.
 */
export function bestRawWords(sec: number, cones: number | null): string {
  const hit = rawConesWords(cones);
  return `Best raw ${boardTime(sec)} s${hit ? ` (that run ${hit})` : ''}`;
}

export function rawConesWords(cones: number | null): string | null {
  if (!cones) return null;
  return `+${cones} ${cones === 1 ? 'cone' : 'cones'}`;
}

/** How far a line is off its class's fastest at an event, in words; null when it has no time to compare. */
export function offFastestWords(pct: number | null): string | null {
  if (pct === null) return null;
  return pct === 0 ? 'Fastest in class' : `${formatPercent(pct)} off fastest`;
}

/** Below this a slope is shown as holding steady: it would read "0.00 %", as the board's percentages are to 0.01. */
const STEADY_PCT_PER_EVENT = 0.005;

/**
 * The season's trend in words. The slope is the change in % off the class's fastest per event:
 * negative means the car is closing in on the fastest.
 */
export function trendWords(slopePctPerEvent: number | null, events: number): string {
  if (slopePctPerEvent === null) return 'Not enough events yet for a trend.';
  const over = `over ${events} ${events === 1 ? 'event' : 'events'}`;
  // To two decimals, as every other percentage on the board.
  const size = Math.abs(slopePctPerEvent).toFixed(2);
  if (Math.abs(slopePctPerEvent) < STEADY_PCT_PER_EVENT) return `Holding steady against the class’s fastest ${over}.`;
  return slopePctPerEvent < 0 ? `Closing in by ${size} % per event ${over}.` : `Falling back by ${size} % per event ${over}.`;
}

/** The trend sentence of a car no other car in its class has a time beside: there is no class fastest but itself. */
export function aloneWords(classCode: string): string {
  return `The only car in class ${classCode} with times this season: there is no one in the class to compare it with yet.`;
}

export interface SetupLine {
  label: string;
  front: string;
  rear: string;
}

const clicks = (n: number | null) => (n === null ? '—' : `${n} ${n === 1 ? 'click' : 'clicks'}`);

/** A shared setup, front and rear, in the user's units. */
export function setupLines(setup: NonNullable<BoardCar['setup']>, units: UnitPreferences): SetupLine[] {
  return [
    { label: 'Camber', front: formatQuantity(setup.frontCamberDeg, 'angle', units), rear: formatQuantity(setup.rearCamberDeg, 'angle', units) },
    {
      label: 'Springs',
      front: formatQuantity(setup.frontSpringNPerMm, 'springRate', units),
      rear: formatQuantity(setup.rearSpringNPerMm, 'springRate', units),
    },
    { label: 'Clicks', front: clicks(setup.frontClicks), rear: clicks(setup.rearClicks) },
    {
      label: 'Cold pressure',
      front: formatQuantity(setup.frontColdKpa, 'pressure', units),
      rear: formatQuantity(setup.rearColdKpa, 'pressure', units),
    },
  ];
}

/**
 * One axle's latest tread in plain words and the user's units: "Front tread 5.1 mm, inner 0.4 mm lower than outer · 7 Jun".
 * The lower edge is the more worn one; "inner and outer even" when the difference rounds to 0 in the unit shown.
 */
export function wearLine(axle: 'Front' | 'Rear', wear: BoardAxleWear | null, units: UnitPreferences): string {
  if (!wear) return `${axle} tread: no reading of both ${axle.toLowerCase()} tyres this season`;
  const skew = wear.innerMinusOuterMm;
  const gap = formatQuantity(Math.abs(skew), 'treadDepth', units);
  const edges =
    Number(toInputText(Math.abs(skew), 'treadDepth', units)) === 0
      ? 'inner and outer even'
      : skew < 0
        ? `inner ${gap} lower than outer`
        : `outer ${gap} lower than inner`;
  return `${axle} tread ${formatQuantity(wear.meanDepthMm, 'treadDepth', units)}, ${edges} · ${formatShortDay(wear.takenAt)}`;
}

/** The year on this device, the season most people mean. */
export function currentSeason(): number {
  return new Date().getFullYear();
}

/** A season from an address (`?season=2026`), or null when missing or not a plausible year. */
export function parseSeason(raw: string | null): number | null {
  if (raw === null || !/^\d{4}$/.test(raw)) return null;
  const year = Number(raw);
  return year >= 1950 && year <= 2200 ? year : null;
}
