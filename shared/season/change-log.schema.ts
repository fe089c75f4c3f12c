import * as z from '../zod';
import { isoDate } from '../api/dates.schema';

export const CHANGE_LOCATIONS = ['lf', 'rf', 'lr', 'rr', 'front', 'rear', 'car'] as const;

export const createChangeInputSchema = z.strictObject({
  id: z.optional(z.uuid()),
  changedOn: isoDate(),
  what: z.string().check(z.trim(), z.minLength(1, 'Say what was changed'), z.maxLength(200, 'Use at most 200 characters')),
  location: z._default(z.enum(CHANGE_LOCATIONS), 'car'),
  notes: z.optional(z.nullable(z.string().check(z.trim(), z.maxLength(2000)))),
  setupId: z.optional(z.nullable(z.uuid())),
});
export type CreateChangeInput = z.infer<typeof createChangeInputSchema>;

export interface ChangeLogEntry {
  id: string;
  carId: string;
  changedOn: string;
  what: string;
  location: (typeof CHANGE_LOCATIONS)[number];
  notes: string | null;
  setupId: string | null;
  /** Written by a shop when it handed the car back: it stays with that visit and cannot be deleted. */
  fromVisit: boolean;
  createdBy: { id: string; displayName: string };
  createdAt: string;
}
