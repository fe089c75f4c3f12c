import type * as z from '@shared/zod';

/**
 * Marks a problem on one input from inside a form schema's `z.transform` (zod/mini's transform
 * context has no `addIssue`): the issue zod's own `ctx.addIssue({ code: 'custom', path, message })` makes.
 */
export function addIssue(ctx: z.core.ParsePayload, path: PropertyKey[], message: string): void {
  ctx.issues.push({ code: 'custom', path, message, input: ctx.value });
}
