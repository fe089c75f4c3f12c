// @vitest-environment jsdom
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { matchRoutes, type RouteObject } from 'react-router-dom';
import { QueryClient } from '@tanstack/react-query';
import { createRoutes } from '@/app/router';
import { PAGE_MODULES } from '../../../server/lib/page-preload';

const ROOT = join(import.meta.dirname, '..', '..', '..');

// The server names a page's chunks in the document by address (server/lib/page-preload.ts); if a
// route moved to another module or address, it would preload the wrong file and the page would
// wait for its own again.
describe('the chunks the server names for a page', () => {
  const { routes } = createRoutes(new QueryClient(), { waiting: () => false, read: Promise.resolve() });

  it.each(PAGE_MODULES.map((p) => [p.example, p.module, p.pattern] as const))(
    'when %s is opened, then the client router loads its page from %s',
    async (address, module, pattern) => {
      expect(pattern.test(address)).toBe(true);
      const leaf = matchRoutes(routes, address)?.at(-1)?.route as RouteObject | undefined;
      expect(typeof leaf?.lazy).toBe('function');
      const { Component } = await (leaf!.lazy as () => Promise<{ Component?: unknown }>)();
      const exports = (await import(/* @vite-ignore */ join(ROOT, module))) as Record<string, unknown>;
      expect(Object.values(exports)).toContain(Component);
    },
  );
});
