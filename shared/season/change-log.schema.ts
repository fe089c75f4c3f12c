import { z } from 'zod';

export const CHANGE_LOCATIONS = ['lf', 'rf', 'lr', 'rr', 'front', 'rear', 'car'] as const;

export const createChangeInputSchema = z.strictObject({
  id: z.uuid().optional(),
  changedOn: z.iso.date({ error: 'Use a date such as 2026-06-12' }),
  what: z.string().trim().min(1, 'Say what was changed').max(200, 'Use at most 200 characters'),
  location: z.enum(CHANGE_LOCATIONS).default('car'),
  notes: z.string().trim().max(2000).nullable().optional(),
  setupId: z.uuid().nullable().optional(),
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
  createdBy: { id: string; displayName: string };
  createdAt: string;
}
