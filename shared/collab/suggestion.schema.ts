import * as z from '../zod';
import { isoDateTime } from '../api/dates.schema';
import { CORNERS, type Corner } from '../season/corners';
import { SETUP_CORNER_FIELDS, type Setup, type SetupCornerField } from '../season/setup.schema';

const text = (max: number, empty: string) =>
  z.string({ error: empty }).check(z.trim(), z.minLength(1, empty), z.maxLength(max, `Use at most ${max} characters`));

/**
 * One proposed change: a field on some corners, by a delta (camber −0.5°) or to a value
 * (clicks 6). SI units, like every stored setup value.
 */
export const suggestionChangeSchema = z
  .strictObject({
    field: z.enum(SETUP_CORNER_FIELDS, { error: 'Pick what to change' }),
    corners: z.array(z.enum(CORNERS)).check(z.minLength(1, 'Pick at least one corner')),
    delta: z.optional(z.number({ error: 'The change must be a number' })),
    value: z.optional(z.number({ error: 'The value must be a number' })),
  })
  .check(
    z.refine((c) => (c.delta === undefined) !== (c.value === undefined), {
      message: 'Give either a change (delta) or a new value, not both',
      path: ['delta'],
    }),
  );
export type SuggestionChange = z.infer<typeof suggestionChangeSchema>;

export const createSuggestionInputSchema = z.strictObject({
  id: z.optional(z.uuid()),
  baseSetupId: z.uuid({ error: 'Pick the setup this changes' }),
  title: text(120, 'Give the suggestion a title'),
  rationale: text(4000, 'Say why'),
  changes: z.array(suggestionChangeSchema).check(z.minLength(1, 'Propose at least one change'), z.maxLength(20)),
});
export type CreateSuggestionInput = z.infer<typeof createSuggestionInputSchema>;


export const acceptSuggestionInputSchema = z.strictObject({
  /** Client-made id for the new snapshot, so a resend never makes two. */
  setupId: z.optional(z.uuid()),
  effectiveFrom: isoDateTime(),
  label: z.optional(z.string().check(z.trim(), z.minLength(1), z.maxLength(80, 'Use at most 80 characters'))),
});
export type AcceptSuggestionInput = z.infer<typeof acceptSuggestionInputSchema>;

export const declineSuggestionInputSchema = z.strictObject({
  note: text(2000, 'Say why, so the shop knows'),
});
export type DeclineSuggestionInput = z.infer<typeof declineSuggestionInputSchema>;

export const SUGGESTION_STATUSES = ['open', 'accepted', 'declined', 'withdrawn'] as const;
export type SuggestionStatus = (typeof SUGGESTION_STATUSES)[number];

/** One corner's value before and after a change. */
export interface SuggestionPreviewCell {
  field: SetupCornerField;
  corner: Corner;
  from: number | null;
  to: number | null;
}

/** A setup snapshot as a suggestion names it. */
export interface SuggestionSetupRef {
  id: string;
  label: string;
  effectiveFrom: string;
}

export interface Suggestion {
  id: string;
  carId: string;
  baseSetup: SuggestionSetupRef;
  shop: { id: string; name: string };
  author: { id: string; displayName: string };
  title: string;
  rationale: string;
  changes: SuggestionChange[];
  /** Each change worked out against the base snapshot: from → to per corner. */
  preview: SuggestionPreviewCell[];
  /**
   * While open, when the setup in force now is no longer the base: that setup, and the changes worked out against
   * it (what accepting now would record), with why that setup cannot take them, if it cannot (a value it lacks, a
   * result out of range; the car's click range is checked on accepting). Otherwise null.
   */
  now: { setup: SuggestionSetupRef; preview: SuggestionPreviewCell[]; problems: string[] } | null;
  /**
   * Once accepted: the setup accepting recorded, the one it was made from, and each change as recorded (from the
   * setup it was made from to the recorded setup). Null otherwise, or when that setup has since been deleted.
   */
  recorded: { setup: SuggestionSetupRef; from: SuggestionSetupRef; preview: SuggestionPreviewCell[] } | null;
  status: SuggestionStatus;
  decidedBy: { id: string; displayName: string } | null;
  decidedAt: string | null;
  decisionNote: string | null;
  acceptedSetupId: string | null;
  createdAt: string;
}

/** POST /api/suggestions/:id/accept: the suggestion, now accepted, and the snapshot it made. */
export interface AcceptedSuggestion {
  suggestion: Suggestion;
  setup: Setup;
}

/** GET /api/suggestions/waiting: an open suggestion on a car the caller drives, waiting for their decision. */
export interface WaitingSuggestion {
  id: string;
  title: string;
  car: { id: string; name: string };
  shop: { id: string; name: string };
  createdAt: string;
}
