import { formatQuantity, type UnitPreferences } from '@shared/calc/units.calc';
import { CORNERS, type Corner, type PerCorner } from '@shared/season/corners';
import { LIMITS } from '@shared/season/limits';
import { inputToSi, typeANumber } from '@/lib/numbers';

export type CornerTextMap = Record<Corner, string>;
export const emptyCornerText = (): CornerTextMap => ({ lf: '', rf: '', lr: '', rr: '' });

/** A corner's field, named as the server names it in its fieldErrors, so a refusal lands on the corner. */
export const hotField = (corner: Corner) => `hotPressuresKpa.${corner}`;

/** readPressures' messages by corner, under the corners' field names (a run form's messages, see RunFormErrors). */
export const hotFieldErrors = (errors: Partial<Record<Corner, string>>): Partial<Record<string, string>> =>
  Object.fromEntries(Object.entries(errors).map(([corner, message]) => [hotField(corner as Corner), message]));

/** A plausible hot pressure for the example in an error, shown in the user's unit (224 kPa ≈ 32.5 psi). */
const EXAMPLE_HOT_KPA = 224;

/** Hot pressures typed in the user's unit, in kPa; errors per corner in the user's unit. */
export function readPressures(
  texts: CornerTextMap,
  units: UnitPreferences,
): { kpa: PerCorner<number> | null; errors: Partial<Record<Corner, string>> } {
  const kpa: PerCorner<number> = {};
  const errors: Partial<Record<Corner, string>> = {};
  for (const corner of CORNERS) {
    const si = inputToSi(texts[corner], 'pressure', units);
    if (si === null) continue;
    if (si === 'invalid') errors[corner] = typeANumber(formatQuantity(EXAMPLE_HOT_KPA, 'pressure', units));
    else if (si < LIMITS.pressureKpa.min || si > LIMITS.pressureKpa.max) {
      errors[corner] = `Between ${formatQuantity(LIMITS.pressureKpa.min, 'pressure', units)} and ${formatQuantity(LIMITS.pressureKpa.max, 'pressure', units)}`;
    } else kpa[corner] = si;
  }
  return { kpa: Object.keys(kpa).length ? kpa : null, errors };
}
