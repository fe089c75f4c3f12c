import type { QuickChangeInput, Setup } from '@shared/season/setup.schema';
import { CORNERS } from '@shared/season/corners';
import { cornerProblems } from '@/lib/setup-corner-problems';
import { applyQuickChange, type AppliedQuickChange } from './setup-views';

/** A quick change applied as the server will apply it, with everything the server would refuse in it. */
export function checkedQuickChange(base: Pick<Setup, 'corners'> | null, changes: QuickChangeInput['changes']): AppliedQuickChange {
  const applied = applyQuickChange(base, changes);
  return { corners: applied.corners, problems: [...applied.problems, ...CORNERS.flatMap((c) => cornerProblems(c, applied.corners[c]))] };
}
