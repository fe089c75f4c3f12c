import * as z from '@shared/zod';
import { formatQuantity, fromDisplay, type UnitPreferences } from '@shared/calc/units.calc';
import { LIMITS } from '@shared/season/limits';
import { createTyreSetInputSchema, type CreateTyreSetInput } from '@shared/season/tyre.schema';
import { parseDecimal, tidy, typeANumber } from '@/lib/numbers';
import { addIssue } from '@/lib/form-schema';

/** What the new-tyre-set form holds, as typed; the starting depth in the user's tread unit. */
export interface TyreSetFormValues {
  label: string;
  size: string;
  boughtOn: string;
  startTreadMm: string;
}

const optionalText = (s: string) => (s.trim() ? s.trim() : null);

/** The form's values → the body of POST /api/cars/:carId/tyre-sets; a depth typed in /32 in is sent in mm. */
export function tyreSetFormSchema(units: UnitPreferences) {
  const range = `${formatQuantity(LIMITS.treadMm.min, 'treadDepth', units)} and ${formatQuantity(LIMITS.treadMm.max, 'treadDepth', units)}`;
  return z.pipe(
    z.object({ label: z.string(), size: z.string(), boughtOn: z.string(), startTreadMm: z.string() }),
    z.transform((v, ctx): CreateTyreSetInput => {
      let depthFailed = false;
      let startTreadMm: number | null = null;
      const parsed = parseDecimal(v.startTreadMm);
      if (parsed.kind === 'invalid') {
        depthFailed = true;
        addIssue(ctx, ['startTreadMm'], typeANumber());
      } else if (parsed.kind === 'number') {
        startTreadMm = tidy(fromDisplay(parsed.value, 'treadDepth', units));
        if (startTreadMm < LIMITS.treadMm.min || startTreadMm > LIMITS.treadMm.max) {
          depthFailed = true;
          addIssue(ctx, ['startTreadMm'], `Between ${range}`);
        }
      }
      const body = {
        label: v.label,
        size: optionalText(v.size),
        boughtOn: v.boughtOn ? v.boughtOn : null,
        startTreadMm,
      };
      const checked = createTyreSetInputSchema.safeParse(body);
      if (!checked.success) {
        for (const issue of checked.error.issues) {
          if (depthFailed && issue.path[0] === 'startTreadMm') continue;
          addIssue(ctx, issue.path.map(String), issue.path[0] === 'boughtOn' ? 'Use a date such as 2026-03-20' : issue.message);
        }
        return z.NEVER;
      }
      return depthFailed ? z.NEVER : checked.data;
    }),
  );
}
