import * as z from '../zod';
import { emailSchema } from '../auth/auth.schema';

export const TEAM_SHARING = ['results', 'results_and_setup'] as const;
export type TeamSharing = (typeof TEAM_SHARING)[number];

const classCode = z.string({ error: 'Enter the class' }).check(z.trim(), z.minLength(1, 'Enter the class'), z.maxLength(20, 'Use at most 20 characters'));

export const createTeamInputSchema = z.strictObject({
  name: z.string({ error: 'Enter a name' }).check(z.trim(), z.minLength(1, 'Enter a name'), z.maxLength(80, 'Use at most 80 characters')),
});
export type CreateTeamInput = z.infer<typeof createTeamInputSchema>;

export const enterCarInputSchema = z.strictObject({
  carId: z.uuid({ error: 'Pick a car' }),
  classCode,
  sharing: z._default(z.enum(TEAM_SHARING, { error: 'Choose what to share' }), 'results'),
});
export type EnterCarInput = z.infer<typeof enterCarInputSchema>;

export const updateEntryInputSchema = z.strictObject({
  classCode: z.optional(classCode),
  sharing: z.optional(z.enum(TEAM_SHARING, { error: 'Choose what to share' })),
});
export type UpdateEntryInput = z.infer<typeof updateEntryInputSchema>;

export const updateMemberInputSchema = z.strictObject({ isCaptain: z.boolean({ error: 'Choose captain or member' }) });
export type UpdateMemberInput = z.infer<typeof updateMemberInputSchema>;

/** A captain invites someone by e-mail; asAdmin invites them as a captain. */
export const inviteMemberInputSchema = z.strictObject({
  email: emailSchema,
  asAdmin: z._default(z.boolean({ error: 'Choose captain or member' }), false),
});
export type InviteMemberInput = z.infer<typeof inviteMemberInputSchema>;

export const seasonSchema = z.coerce.number({ error: 'Enter a year' }).check(z.int('Enter a year'), z.gte(1950, 'Enter a year from 1950'), z.lte(2200, 'Enter a year up to 2200'));

/** The most decimals a class factor keeps: published factors have three or four (0.853, 0.8535). */
export const FACTOR_DECIMALS = 4;

/** Whether a number has at most `places` decimals (within the float error of writing it in binary). */
const hasAtMostDecimals = (value: number, places: number) => {
  const scaled = value * 10 ** places;
  return Math.abs(scaled - Math.round(scaled)) < 1e-6;
};

/** The captain enters each class's index factor for a season; none ship with the app. Stored as entered, never rounded. */
export const setFactorInputSchema = z.strictObject({
  season: seasonSchema,
  classCode,
  /** null removes the factor. */
  factor: z.nullable(
    z.number({ error: 'The factor must be a number' }).check(
      z.gt(0, 'The factor must be above 0'),
      z.lte(2, 'The factor must be at most 2'),
      z.refine((v) => hasAtMostDecimals(v, FACTOR_DECIMALS), `Use at most ${FACTOR_DECIMALS} decimals, as in 0.8535`),
    ),
  ),
});
export type SetFactorInput = z.infer<typeof setFactorInputSchema>;

export const seasonQuerySchema = z.strictObject({ season: z.optional(seasonSchema) });
export type SeasonQuery = z.infer<typeof seasonQuerySchema>;

export interface TeamSummary {
  id: string;
  name: string;
  isCaptain: boolean;
}

export interface TeamEntry {
  car: { id: string; name: string; carNumber: string | null };
  owner: { id: string; displayName: string };
  classCode: string;
  sharing: TeamSharing;
  /** The signed-in user may change or withdraw this entry. */
  mine: boolean;
}

export interface Team extends TeamSummary {
  members: { id: string; displayName: string; isCaptain: boolean }[];
  entries: TeamEntry[];
  pendingInvitations: { email: string; asAdmin: boolean; expiresAt: string }[];
}

export interface ClassFactor {
  season: number;
  classCode: string;
  factor: number;
}

/** One car's day on the board (best over its drivers, each driver scored separately). */
export interface BoardResult {
  eventId: string;
  eventName: string;
  date: string;
  driver: { id: string; displayName: string };
  /** How the driver's runs that day ended: a day without a time is one whose runs were all DNF or off course. */
  runs: { finished: number; dnf: number; offCourse: number };
  /** The fastest clock time, cones not added; it may come from another run than the best adjusted time. */
  bestRawSec: number | null;
  /** The cones hit on the run of the best raw time (0 for a clean run); null without a time. */
  bestRawCones: number | null;
  bestAdjustedSec: number | null;
  /** Adjusted × the class factor; null when the captain has entered none. */
  indexSec: number | null;
  /**
   * Against the class's fastest adjusted time at that event on the board; null, with the rank, when no other line in
   * the class set a time there (`aloneInClass`): a day run alone is no comparison, and stays out of the trend.
   */
  pctOffClassFastest: number | null;
  rankInClass: number | null;
  /** The only time in the class at that event on the board. Absent from answers before it was added. */
  aloneInClass?: boolean;
}

/** One axle's latest complete tread reading (both of its corners), as means over those two corners. */
export interface BoardAxleWear {
  /** Mean of the inner, middle and outer depths of the two corners, mm. */
  meanDepthMm: number;
  /** Mean of inner minus outer depth, mm: below 0, the inner edges are the more worn. */
  innerMinusOuterMm: number;
  takenAt: string;
}

export interface BoardCar {
  car: { id: string; name: string; carNumber: string | null };
  owner: { id: string; displayName: string };
  sharing: TeamSharing;
  results: BoardResult[];
  /** Slope of % off the class's fastest per event over the season (negative: closing in). */
  trendPctPerEvent: number | null;
  /** The setup in force at the latest event, when the member shares setups; null otherwise. */
  setup: {
    label: string;
    effectiveFrom: string;
    frontCamberDeg: number | null;
    rearCamberDeg: number | null;
    frontSpringNPerMm: number | null;
    rearSpringNPerMm: number | null;
    frontClicks: number | null;
    rearClicks: number | null;
    frontColdKpa: number | null;
    rearColdKpa: number | null;
  } | null;
  /** The latest tread reading per axle up to the season's end, when the member shares setups; null otherwise or without readings. */
  wear: { front: BoardAxleWear | null; rear: BoardAxleWear | null } | null;
}

export interface ClassBoard {
  team: TeamSummary;
  season: number;
  classes: { classCode: string; factor: number | null; cars: BoardCar[] }[];
}
