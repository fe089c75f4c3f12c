import { z } from 'zod';
import { LIMITS } from './limits';

export const EVENT_KINDS = ['autocross', 'track_day'] as const;

const temperature = z.number().min(LIMITS.temperatureC.min).max(LIMITS.temperatureC.max).nullable().optional();

export const createEventInputSchema = z.strictObject({
  /** Client-made id, so an event created with no signal is not made twice on replay. */
  id: z.uuid().optional(),
  name: z.string().trim().min(1, 'Give the event a name').max(120, 'Use at most 120 characters'),
  date: z.iso.date({ error: 'Use a date such as 2026-06-12' }),
  venue: z.string().trim().max(120).nullable().optional(),
  kind: z.enum(EVENT_KINDS).default('autocross'),
  /** Seconds added per cone; 2 s is common practice in autocross. */
  conePenaltySec: z
    .number()
    .min(LIMITS.conePenaltySec.min, 'The cone penalty cannot be negative')
    .max(LIMITS.conePenaltySec.max, `The cone penalty must be at most ${LIMITS.conePenaltySec.max} s`)
    .default(2),
  surface: z.string().trim().max(80).nullable().optional(),
  airTempC: temperature,
  trackTempC: temperature,
  notes: z.string().trim().max(2000).nullable().optional(),
  teamId: z.uuid().nullable().optional(),
});
export type CreateEventInput = z.infer<typeof createEventInputSchema>;

export interface SeasonEvent {
  id: string;
  name: string;
  date: string;
  venue: string | null;
  kind: (typeof EVENT_KINDS)[number];
  conePenaltySec: number;
  surface: string | null;
  airTempC: number | null;
  trackTempC: number | null;
  notes: string | null;
  teamId: string | null;
  createdBy: string;
  createdAt: string;
}
