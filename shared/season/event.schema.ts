import * as z from '../zod';
import { isoDate } from '../api/dates.schema';
import { LIMITS } from './limits';

export const EVENT_KINDS = ['autocross', 'track_day'] as const;

const temperature = z.optional(z.nullable(z.number().check(z.gte(LIMITS.temperatureC.min), z.lte(LIMITS.temperatureC.max))));
/** Trimmed free text of at most `max` characters; optional, and null clears it. */
const optionalText = (max: number) => z.optional(z.nullable(z.string().check(z.trim(), z.maxLength(max))));

export const createEventInputSchema = z.strictObject({
  /** Client-made id, so an event created with no signal is not made twice on replay. */
  id: z.optional(z.uuid()),
  name: z.string().check(z.trim(), z.minLength(1, 'Give the event a name'), z.maxLength(120, 'Use at most 120 characters')),
  date: isoDate(),
  venue: optionalText(120),
  kind: z._default(z.enum(EVENT_KINDS), 'autocross'),
  /** Seconds added per cone; 2 s is common practice in autocross. */
  conePenaltySec: z._default(
    z
      .number()
      .check(
        z.gte(LIMITS.conePenaltySec.min, 'The cone penalty cannot be negative'),
        z.lte(LIMITS.conePenaltySec.max, `The cone penalty must be at most ${LIMITS.conePenaltySec.max} s`),
      ),
    2,
  ),
  surface: optionalText(80),
  airTempC: temperature,
  trackTempC: temperature,
  notes: optionalText(2000),
  teamId: z.optional(z.nullable(z.uuid())),
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
