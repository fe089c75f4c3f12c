import * as z from '@shared/zod';

/** Path parameters are UUIDs; anything else is simply not found. */
export const idParam = (...names: string[]) =>
  z.object(Object.fromEntries(names.map((n) => [n, z.uuid({ error: 'Not a valid id' })])));

/** The list shape every list endpoint answers with. */
export const list = <T>(items: T[]) => ({ items, count: items.length });
