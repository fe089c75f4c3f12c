import * as z from '@shared/zod';
import { formatQuantity, fromDisplay, toDisplay, type UnitPreferences } from '@shared/calc/units.calc';
import { createEventInputSchema, EVENT_KINDS, type CreateEventInput } from '@shared/season/event.schema';
import { LIMITS } from '@shared/season/limits';
import { parseDecimal, tidy, typeANumber } from '@/lib/numbers';
import { addIssue } from '@/lib/form-schema';

/** What the new-event form holds: text as typed, temperatures in the user's unit. */
export interface EventFormValues {
  name: string;
  date: string;
  venue: string;
  kind: (typeof EVENT_KINDS)[number];
  conePenaltySec: string;
  surface: string;
  /** In the user's temperature unit (°C or °F), as typed. */
  airTempC: string;
  trackTempC: string;
}

export const EVENT_FORM_FIELDS = ['name', 'date', 'venue', 'kind', 'conePenaltySec', 'surface', 'airTempC', 'trackTempC'] as const;

/** The usual cone penalty; the form says to use the club's own rule. */
export const DEFAULT_CONE_PENALTY_SEC = 2;

export function emptyEventForm(today: string): EventFormValues {
  return {
    name: '',
    date: today,
    venue: '',
    kind: 'autocross',
    conePenaltySec: String(DEFAULT_CONE_PENALTY_SEC),
    surface: '',
    airTempC: '',
    trackTempC: '',
  };
}

const optionalText = (s: string) => (s.trim() ? s.trim() : null);

/**
 * The form's values → the body of POST /api/events, checked with the shared schema so the
 * form refuses what the server would. Temperatures typed in °F are sent in °C; every problem
 * lands on the input it concerns, all at once.
 */
export function eventFormSchema(units: UnitPreferences) {
  const range = `${formatQuantity(LIMITS.temperatureC.min, 'temperature', units)} and ${formatQuantity(LIMITS.temperatureC.max, 'temperature', units)}`;
  return z.pipe(
    z.object({
      name: z.string(),
      date: z.string(),
      venue: z.string(),
      kind: z.enum(EVENT_KINDS),
      conePenaltySec: z.string(),
      surface: z.string(),
      airTempC: z.string(),
      trackTempC: z.string(),
    }),
    z.transform((v, ctx): CreateEventInput => {
      const local = new Set<string>();
      const temperature = (field: 'airTempC' | 'trackTempC'): number | null => {
        const parsed = parseDecimal(v[field]);
        if (parsed.kind === 'empty') return null;
        if (parsed.kind === 'invalid') {
          local.add(field);
          // A mild day, 21 °C, in the user's unit (70 in °F).
          addIssue(ctx, [field], typeANumber(String(Math.round(toDisplay(21, 'temperature', units)))));
          return null;
        }
        const celsius = tidy(fromDisplay(parsed.value, 'temperature', units));
        if (celsius < LIMITS.temperatureC.min || celsius > LIMITS.temperatureC.max) {
          local.add(field);
          addIssue(ctx, [field], `Between ${range}`);
        }
        return celsius;
      };
      // The date picker left empty: asked for plainly, not with the API's ISO example.
      if (!v.date.trim()) {
        local.add('date');
        addIssue(ctx, ['date'], 'Pick a date');
      }
      let conePenaltySec = DEFAULT_CONE_PENALTY_SEC;
      const cone = parseDecimal(v.conePenaltySec);
      if (cone.kind === 'number') conePenaltySec = cone.value;
      else {
        local.add('conePenaltySec');
        addIssue(ctx, ['conePenaltySec'], 'Type the seconds added per cone, e.g. 2');
      }
      const body = {
        name: v.name,
        date: v.date,
        venue: optionalText(v.venue),
        kind: v.kind,
        conePenaltySec,
        surface: optionalText(v.surface),
        airTempC: temperature('airTempC'),
        trackTempC: temperature('trackTempC'),
      };
      const checked = createEventInputSchema.safeParse(body);
      if (!checked.success) {
        for (const issue of checked.error.issues) {
          const field = String(issue.path[0] ?? '');
          if (!local.has(field)) addIssue(ctx, issue.path as PropertyKey[], issue.message);
        }
        return z.NEVER;
      }
      if (local.size > 0) return z.NEVER;
      return checked.data;
    }),
  );
}

