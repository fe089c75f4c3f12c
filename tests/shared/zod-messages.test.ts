import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import * as z from '../../shared/zod';
import { createRunInputSchema } from '../../shared/season/run.schema';
import { toFieldErrors } from '../../shared/api/api-error.schema';

// The messages a field shows when its schema gives none of its own. They are read beside the field's
// label, on the phone and in the API's fieldErrors, so they name the limit in plain words.

const run = (over: Record<string, unknown> = {}) => ({
  id: randomUUID(),
  carId: randomUUID(),
  eventId: randomUUID(),
  runNumber: 1,
  rawTimeSec: 45.678,
  recordedAt: '2026-04-12T10:00:00Z',
  ...over,
});

function errorsOf(input: unknown) {
  const checked = createRunInputSchema.safeParse(input);
  if (checked.success) throw new Error('expected the run to be refused');
  return toFieldErrors(checked.error);
}

describe('the messages of a run whose schema gives none', () => {
  it('when the run number is missing, then "Required"; over its limit of 999, then "At most 999"', () => {
    const { runNumber: _omit, ...noNumber } = run();
    expect(errorsOf(noNumber).runNumber).toEqual(['Required']);
    expect(errorsOf(run({ runNumber: 1000 })).runNumber).toEqual(['At most 999']);
    expect(errorsOf(run({ runNumber: '7' })).runNumber).toEqual(['Expected a number']);
  });

  it('when the notes are longer than 2000 characters, then "At most 2000 characters"', () => {
    expect(errorsOf(run({ notes: 'x'.repeat(2001) })).notes).toEqual(['At most 2000 characters']);
    expect(createRunInputSchema.safeParse(run({ notes: 'x'.repeat(2000) })).success).toBe(true);
  });

  it('when the status is not one of the three, then the three are named', () => {
    expect(errorsOf(run({ status: 'crashed' })).status).toEqual(['Choose one of: finished, dnf, off_course']);
  });

  it('when the car id is not a UUID, then "Not a valid id"', () => {
    expect(errorsOf(run({ carId: 'car-1' })).carId).toEqual(['Not a valid id']);
  });

  it('when a schema gives its own message, then that message wins', () => {
    expect(errorsOf(run({ runNumber: 0 })).runNumber).toEqual(['Run numbers start at 1']);
    expect(errorsOf(run({ id: 'run-1' })).id).toEqual(['The run id must be a UUID']);
  });
});

describe('every kind of check, in plain words', () => {
  const messageOf = (schema: z.ZodMiniType, value: unknown) => {
    const checked = schema.safeParse(value);
    return checked.success ? null : checked.error.issues.map((i) => i.message);
  };

  it.each<[string, z.ZodMiniType, unknown, string]>([
    ['a missing value', z.string(), undefined, 'Required'],
    ['a null', z.number(), null, 'Required'],
    ['text for a flag', z.boolean(), 'yes', 'Expected yes or no'],
    ['a number for a list', z.array(z.string()), 3, 'Expected a list'],
    ['an empty text that needs one character', z.string().check(z.minLength(1)), '', 'Required'],
    ['a text over its length', z.string().check(z.maxLength(3)), 'four', 'At most 3 characters'],
    ['a text under its length', z.string().check(z.minLength(3)), 'ab', 'At least 3 characters'],
    ['a text of the wrong length', z.string().check(z.length(4)), 'abc', 'Exactly 4 characters'],
    ['a number at an exclusive top', z.number().check(z.lt(10)), 10, 'Less than 10'],
    ['a number at an exclusive bottom', z.number().check(z.gt(0)), 0, 'More than 0'],
    ['a number under its floor', z.number().check(z.gte(-5)), -6, 'At least -5'],
    ['a list with too many items', z.array(z.number()).check(z.maxLength(2)), [1, 2, 3], 'At most 2 items'],
    ['an empty list that needs one item', z.array(z.number()).check(z.minLength(1)), [], 'At least 1 item'],
    ['a text over one character', z.string().check(z.maxLength(1)), 'ab', 'At most 1 character'],
    ['a number off its step', z.number().check(z.multipleOf(0.5)), 0.3, 'In steps of 0.5'],
    ['a value that must be one thing', z.literal('kPa'), 'psi', 'Must be kPa'],
    ['an e-mail address without its @', z.email(), 'maren.example.com', 'Enter an e-mail address'],
    ['a date in another form', z.iso.date(), '12/06/2026', 'Enter a date as YYYY-MM-DD'],
    ['a text off its pattern', z.string().check(z.regex(/^[A-Z]{2}$/)), 'abc', 'Not in the expected form'],
    ['a value no option of a union takes', z.union([z.number(), z.boolean()]), 'x', 'Not a valid value'],
  ])('%s', (_name, schema, value, message) => {
    expect(messageOf(schema, value)).toEqual([message]);
  });

  it('when an object has fields it does not know, then they are named', () => {
    expect(messageOf(z.strictObject({ a: z.number() }), { a: 1, b: 2, c: 3 })).toEqual(['Unknown fields: b, c']);
  });
});
