/**
 * The zod every shared schema is built with: `zod/mini`, the tree-shakable form of zod 4, so the
 * client downloads only the parts the schemas use. Checks are functions (`z.string().check(z.trim(),
 * z.maxLength(80, '…'))`, `z.optional(x)`, `z._default(x, v)`) instead of chained methods.
 *
 * zod/mini leaves the default messages unset. The ones installed here are for a person at a form as
 * much as for a program reading the API's field errors: short, in plain words, next to the field they
 * name ("At most 999", "Required"), instead of a type checker's ("Too big: expected number to be
 * <=999"). A message a schema gives itself always wins.
 */
import { config } from 'zod/mini';
import type { $ZodErrorMap } from 'zod/v4/core';

/** What a value should have been, for a value of the wrong kind. */
const KINDS: Record<string, string> = {
  number: 'a number',
  int: 'a whole number',
  bigint: 'a whole number',
  string: 'text',
  boolean: 'yes or no',
  date: 'a date',
  array: 'a list',
  object: 'a set of fields',
};

/** What a size counts, for the checks on a length or a count: one, and more than one. */
const UNITS: Record<string, [string, string]> = {
  string: ['character', 'characters'],
  array: ['item', 'items'],
  set: ['item', 'items'],
  map: ['entry', 'entries'],
  file: ['byte', 'bytes'],
};

const FORMATS: Record<string, string> = {
  email: 'Enter an e-mail address',
  url: 'Enter a web address',
  date: 'Enter a date as YYYY-MM-DD',
  datetime: 'Enter a date and time',
  time: 'Enter a time as HH:MM',
};

const list = (values: readonly unknown[]) => values.map(String).join(', ');

export const plainMessage: $ZodErrorMap = (issue) => {
  switch (issue.code) {
    case 'invalid_type':
      if (issue.input == null) return 'Required';
      return `Expected ${KINDS[issue.expected] ?? issue.expected}`;
    case 'too_big':
    case 'too_small': {
      const big = issue.code === 'too_big';
      const limit = big ? issue.maximum : issue.minimum;
      // An empty text where one is needed reads as a missing value, not as a length.
      if (!big && issue.origin === 'string' && Number(limit) === 1 && !issue.exact) return 'Required';
      if (issue.origin === 'date') return big ? 'Too late' : 'Too early';
      const words = issue.exact ? 'Exactly' : big ? (issue.inclusive ? 'At most' : 'Less than') : issue.inclusive ? 'At least' : 'More than';
      const unit = UNITS[issue.origin]?.[Number(limit) === 1 ? 0 : 1];
      return `${words} ${String(limit)}${unit ? ` ${unit}` : ''}`;
    }
    case 'invalid_format':
      return FORMATS[issue.format] ?? (/^(uuid|guid|cuid2?|ulid|nanoid|xid|ksuid)/.test(issue.format) ? 'Not a valid id' : 'Not in the expected form');
    case 'not_multiple_of':
      return `In steps of ${String(issue.divisor)}`;
    case 'invalid_value':
      return issue.values.length === 1 ? `Must be ${list(issue.values)}` : `Choose one of: ${list(issue.values)}`;
    case 'unrecognized_keys':
      return `Unknown field${issue.keys.length > 1 ? 's' : ''}: ${list(issue.keys)}`;
    default:
      return 'Not a valid value';
  }
};

config({ localeError: plainMessage });

export * from 'zod/mini';
