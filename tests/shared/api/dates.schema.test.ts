import { describe, expect, it } from 'vitest';
import * as z from '../../../shared/zod';
import { isoDate, isoDateTime } from '../../../shared/api/dates.schema';

const messages = (schema: z.core.$ZodType, value: unknown) => {
  const checked = z.safeParse(schema, value);
  return checked.success ? [] : checked.error.issues.map((i) => i.message);
};

describe('dates as the API takes them', () => {
  it('when a date is left blank, then the one message is the format\'s example, with no word about years', () => {
    expect(messages(isoDate(), '')).toEqual(['Use a date such as 2026-06-12']);
    expect(messages(isoDateTime(), '')).toEqual(['Use a date and time such as 2026-06-12T09:30:00Z']);
  });

  it('when a value is not a date at all, then only the format\'s example is given', () => {
    expect(messages(isoDate(), '12/06/2026')).toEqual(['Use a date such as 2026-06-12']);
    expect(messages(isoDateTime(), 'yesterday')).toEqual(['Use a date and time such as 2026-06-12T09:30:00Z']);
  });

  it('when a date is well formed but its year is one no season has, then only the years are named', () => {
    expect(messages(isoDate(), '0026-06-12')).toEqual(['Use a year from 1900 to 2199']);
    expect(messages(isoDateTime(), '2200-01-01T00:00:00Z')).toEqual(['Use a year from 1900 to 2199']);
    expect(messages(isoDate(), '1900-01-01')).toEqual([]);
    expect(messages(isoDate(), '2199-12-31')).toEqual([]);
  });
});
