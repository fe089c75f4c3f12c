/**
 * The zod every shared schema is built with: `zod/mini`, the tree-shakable form of zod 4, so the
 * client downloads only the parts the schemas use. Checks are functions (`z.string().check(z.trim(),
 * z.maxLength(80, '…'))`, `z.optional(x)`, `z._default(x, v)`) instead of chained methods.
 *
 * zod/mini leaves the default messages ("Too big: expected number to be <=999") unset, so the
 * English ones full zod uses are installed here; messages a schema gives itself always win.
 */
import { config } from 'zod/mini';
import en from 'zod/v4/locales/en.js';

config(en());

export * from 'zod/mini';
