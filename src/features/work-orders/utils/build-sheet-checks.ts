import { formatQuantity, type UnitPreferences } from '@shared/calc/units.calc';
import { CORNERS, type Corner } from '@shared/season/corners';
import { BUILD_SHEET_FIELDS, type BuildSheetCorner, type BuildSheetCornerChecks, type WorkOrder } from '@shared/service/work-order.schema';

/** One line of a corner's checks; `failed` when it is a reason to look again before the car leaves. */
export interface CheckLine {
  text: string;
  failed: boolean;
}

/** A corner with nothing written in it yet: never saved, or saved with every box left empty. */
export function isBlankCorner(sheet: BuildSheetCorner | null): boolean {
  return sheet === null || BUILD_SHEET_FIELDS.every((f) => sheet[f] === null);
}

/**
 * The server's checks for one corner, in plain words, in the user's units. `helperListed`: the corner's sheet has a
 * helper spring, so a main spring that lifts off at full droop asks whether that helper's travel covers the gap.
 */
export function checkLines(checks: BuildSheetCornerChecks | null, toleranceMm: number, units: UnitPreferences, helperListed = false): CheckLine[] {
  if (!checks) return [];
  const mm = (v: number) => formatQuantity(v, 'length', units);
  const lines: CheckLine[] = [];
  if (checks.compressedLength) {
    const { differenceMm: d, withinTolerance } = checks.compressedLength;
    const how = d === 0 ? 'the same as the reference' : `${mm(Math.abs(d))} ${d < 0 ? 'shorter' : 'longer'} than the reference`;
    lines.push({
      text: `Compressed length: ${how} — ${
        withinTolerance
          ? `within the shop’s ${mm(toleranceMm)} tolerance.`
          : d > 0
            ? 'longer than the reference: the damper could bottom out before the original bump stop.'
            : `more than ${mm(toleranceMm)} shorter: the wheel could travel into the body. Check clearances.`
      }`,
      failed: !withinTolerance,
    });
  }
  if (checks.droop) {
    const { seated, staticCompressionMm, droopAtSpringMm, shortfallMm } = checks.droop;
    lines.push({
      text: seated
        ? `Main spring stays seated at full droop (compressed ${mm(staticCompressionMm)} at ride height, extends ${mm(droopAtSpringMm)}).`
        : helperListed
          ? `Main spring comes off its seat at full droop by ${mm(shortfallMm)}: the helper spring listed holds it only if it has at least ${mm(shortfallMm)} of travel (its maker's figure); else limit the droop.`
          : `Main spring comes off its seat at full droop: a helper spring needs ${mm(shortfallMm)} of travel, or limit the droop.`,
      failed: !seated,
    });
  }
  if (checks.bumpTravelAtWheelMm !== null) lines.push({ text: `Bump travel left at the wheel: ${mm(checks.bumpTravelAtWheelMm)}.`, failed: false });
  for (const p of checks.problems) lines.push({ text: p, failed: true });
  return lines;
}

/**
 * What to look at again before the car is handed over, corner by corner: each failed check, and each corner left
 * empty once the sheet has been started (a visit with no build sheet at all has nothing to say here).
 */
export function buildSheetAttention(workOrder: WorkOrder, units: UnitPreferences): { corner: Corner; text: string }[] {
  const { corners, checks } = workOrder.buildSheet;
  if (CORNERS.every((c) => isBlankCorner(corners[c]))) return [];
  const mm = (v: number) => formatQuantity(v, 'length', units);
  return CORNERS.flatMap((corner) => {
    if (isBlankCorner(corners[corner])) return [{ corner, text: 'not filled in' }];
    const c = checks[corner];
    if (!c) return [];
    const out: string[] = [];
    if (c.compressedLength && !c.compressedLength.withinTolerance) {
      const d = c.compressedLength.differenceMm;
      out.push(
        d > 0
          ? `compressed length ${mm(d)} longer than the reference`
          : `compressed length ${mm(-d)} shorter than the reference (tolerance ${mm(workOrder.shop.compressedLengthToleranceMm)})`,
      );
    }
    if (c.droop && !c.droop.seated) out.push('main spring comes off its seat at full droop');
    out.push(...c.problems);
    return out.map((text) => ({ corner, text }));
  });
}
