import { formatQuantity, toDisplay, type UnitPreferences } from '@shared/calc/units.calc';
import type { Car } from '@shared/season/car.schema';
import { axleOf, CORNERS, type Corner } from '@shared/season/corners';
import { adjusterFor, type ClickField } from '@shared/season/damper-clicks';
import { SETUP_CORNER_FIELDS, type SetupCorner, type SetupCornerField } from '@shared/season/setup.schema';
import { inputToSi, parseDecimal, toInputText, typeANumber } from '@/lib/numbers';
import { FIELD_INFO } from '@/lib/setup-fields';

export type CornerTexts = Record<SetupCornerField, string>;

/** What the editor's inputs hold: text as typed, in the user's units. */
export interface SetupFormValues {
  label: string;
  effectiveFrom: string;
  notes: string;
  corners: Record<Corner, CornerTexts>;
  axles: { front: { antiRollBar: string }; rear: { antiRollBar: string } };
}

export type SiCorners = Record<Corner, SetupCorner>;

/** A plausible value of each measured field (SI), offered in the user's units when a box holds no number. */
const EXAMPLE_SI: Partial<Record<SetupCornerField, number>> = {
  camberDeg: -1.5, toeMm: 1.5, casterDeg: 6, springRateNPerMm: 70, rideHeightMm: 120, coldPressureKpa: 200, cornerWeightKg: 300,
};

/** "Type a number, e.g. 29" for a pressure in psi, "e.g. 200" in kPa: two significant figures in the user's unit. */
function typeANumberOf(field: SetupCornerField, units: UnitPreferences): string {
  const si = EXAMPLE_SI[field];
  const quantity = FIELD_INFO[field].quantity;
  return si === undefined || !quantity ? typeANumber() : typeANumber(String(Number(toDisplay(si, quantity, units).toPrecision(2))));
}

/** A snapshot's SI values as text in the user's units. */
export function cornersToTexts(corners: Partial<Record<Corner, SetupCorner>> | undefined, units: UnitPreferences): Record<Corner, CornerTexts> {
  return Object.fromEntries(
    CORNERS.map((corner) => [
      corner,
      Object.fromEntries(
        SETUP_CORNER_FIELDS.map((field) => {
          const si = corners?.[corner]?.[field];
          const { quantity } = FIELD_INFO[field];
          return [field, quantity ? toInputText(si, quantity, units) : si === null || si === undefined ? '' : String(si)];
        }),
      ),
    ]),
  ) as Record<Corner, CornerTexts>;
}

/** The most clicks the adjuster for this value allows at a corner, from the car's record (or the general limit). */
export function maxClicks(car: Pick<Car, 'damperAdjusters'> | null, corner: Corner, field: ClickField): number {
  const adjuster = car && adjusterFor(car.damperAdjusters, axleOf(corner), field);
  return adjuster?.positions ?? FIELD_INFO.damperClicks.limits.max;
}

export interface ConvertedCorners {
  corners: SiCorners;
  /** `corners.lf.camberDeg` → message, in the user's units. */
  errors: Record<string, string>;
}

/**
 * The typed values in SI, checked against the plausible ranges (shown in the user's units).
 * A value left as it was shown keeps its stored SI number exactly, so a round trip through
 * psi or inches never shows a change nobody made. A value that cannot be taken keeps the one it
 * started with, beside its error: it is not yet a change, and certainly not a cleared value.
 */
export function textsToSi(
  texts: Record<Corner, CornerTexts>,
  initialTexts: Record<Corner, CornerTexts>,
  initialSi: Partial<Record<Corner, SetupCorner>> | undefined,
  units: UnitPreferences,
  car: Pick<Car, 'damperAdjusters'> | null,
): ConvertedCorners {
  const errors: Record<string, string> = {};
  const corners = {} as SiCorners;
  for (const corner of CORNERS) {
    const out = {} as SetupCorner;
    for (const field of SETUP_CORNER_FIELDS) {
      const text = texts[corner]?.[field] ?? '';
      const path = `corners.${corner}.${field}`;
      const info = FIELD_INFO[field];
      const refuse = (message: string) => {
        errors[path] = message;
        out[field] = initialSi?.[corner]?.[field] ?? null;
      };
      if (text === (initialTexts[corner]?.[field] ?? '') && text !== '') {
        out[field] = initialSi?.[corner]?.[field] ?? null;
        continue;
      }
      if (!info.quantity) {
        const parsed = parseDecimal(text);
        if (parsed.kind === 'empty') out[field] = null;
        else if (parsed.kind === 'invalid' || !Number.isInteger(parsed.value)) refuse('Clicks are whole numbers, e.g. 12');
        else {
          // The values counted without a unit are the clicks.
          const max = maxClicks(car, corner, field as ClickField);
          if (parsed.value < 0 || parsed.value > max) refuse(`Use 0 to ${max} clicks`);
          else out[field] = parsed.value;
        }
        continue;
      }
      const si = inputToSi(text, info.quantity, units);
      if (si === 'invalid') {
        refuse(typeANumberOf(field, units));
        continue;
      }
      if (si !== null && (si < info.limits.min || si > info.limits.max)) {
        refuse(`${info.label} must be between ${formatQuantity(info.limits.min, info.quantity, units)} and ${formatQuantity(info.limits.max, info.quantity, units)}`);
        continue;
      }
      out[field] = si;
    }
    corners[corner] = out;
  }
  return { corners, errors };
}

/** Only the corners with at least one value, as the API takes them. */
export function compactCorners(corners: SiCorners): Partial<Record<Corner, SetupCorner>> {
  const out: Partial<Record<Corner, SetupCorner>> = {};
  for (const corner of CORNERS) {
    const values = corners[corner];
    if (SETUP_CORNER_FIELDS.some((f) => values[f] !== null && values[f] !== undefined)) out[corner] = values;
  }
  return out;
}
