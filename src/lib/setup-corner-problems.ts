import type { Corner } from '@shared/season/corners';
import { setupCornerSchema, type SetupCorner } from '@shared/season/setup.schema';
import { CORNER_NAMES } from '@/components/corner-grid/corner-grid';

/**
 * What the server would refuse among a corner's setup values, each said as the server says it after
 * the corner's name: "Left front: Camber must be between -10 and 5 °". Only the values given are
 * checked, so this takes a whole corner (a quick change) or a single value of it (a suggested change).
 */
export function cornerProblems(corner: Corner, values: Partial<SetupCorner>): string[] {
  const checked = setupCornerSchema.safeParse(values);
  return checked.success ? [] : checked.error.issues.map((issue) => `${CORNER_NAMES[corner]}: ${issue.message}`);
}
