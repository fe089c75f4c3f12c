import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { firstReads } from '@shared/api/first-reads';
import { readBuildManifest, staticClosure } from './build-manifest';

/**
 * Each page's code is a chunk of its own that the client asks for only once its router has started,
 * after the main chunk has arrived and run: one more round trip before the page can ask for its data.
 * The server knows the address the document is for, so it names that page's chunks in the document
 * itself (`<link rel="modulepreload">`) and the browser fetches them beside the main chunk.
 *
 * The address patterns follow the client's routes (src/app/router.tsx); tests/client/app/page-preload-routes.test.tsx
 * checks that each one still leads the client router to the module named here.
 */
/** The trackside page's address; its one group is the event's id, which `pageReads` reads. */
const EVENT_DAY = /^\/events\/([^/]+)\/?$/;

export const PAGE_MODULES: readonly { pattern: RegExp; module: string; example: string }[] = [
  { pattern: EVENT_DAY, module: 'src/app/routes/events/event-day.tsx', example: '/events/e1' },
  { pattern: /^\/events\/?$/, module: 'src/app/routes/events/events.tsx', example: '/events' },
  { pattern: /^\/cars\/[^/]+\/?$/, module: 'src/app/routes/cars/car.tsx', example: '/cars/c1' },
  { pattern: /^\/cars\/?$/, module: 'src/app/routes/cars/cars.tsx', example: '/cars' },
  { pattern: /^\/cars\/[^/]+\/tread\/?$/, module: 'src/app/routes/cars/tread.tsx', example: '/cars/c1/tread' },
  { pattern: /^\/cars\/[^/]+\/review\/?$/, module: 'src/app/routes/analysis/season-review.tsx', example: '/cars/c1/review' },
  { pattern: /^\/$/, module: 'src/app/routes/home.tsx', example: '/' },
];

/**
 * From the build's manifest (dist/.vite/manifest.json): for an address, the `<link rel="modulepreload">`
 * tags of its page's chunk and the chunks that one imports, less those the entry already brings
 * (index.html preloads them). Empty for an address of no listed page, or without a manifest.
 */
export function pagePreloader(clientDir: string): (path: string) => string {
  if (!existsSync(join(clientDir, '.vite', 'manifest.json'))) return () => '';
  const manifest = readBuildManifest(clientDir);
  const closure = (keys: string[]) => staticClosure(manifest, keys);
  const entry = closure(Object.keys(manifest).filter((key) => manifest[key]!.isEntry));
  const tags = new Map<string, string>();
  for (const page of PAGE_MODULES) {
    if (!manifest[page.module]) continue;
    const files = [...closure([page.module])].filter((key) => !entry.has(key)).map((key) => manifest[key]!.file);
    tags.set(page.module, files.map((f) => `<link rel="modulepreload" crossorigin href="/${f}">`).join(''));
  }
  return (path) => {
    const page = PAGE_MODULES.find((p) => p.pattern.test(path));
    return (page && tags.get(page.module)) ?? '';
  };
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/**
 * The API reads a page makes before it can draw, at the addresses its client asks for them
 * (`firstReads`): "who is signed in?" on every page, and on the trackside page the car list,
 * the event and, when the address names the car, its setups and the runs. Named in the document
 * (`<link rel="preload" as="fetch">`), they go out while the scripts download instead of after they
 * have run, and the client's own requests take the answers already on their way: two round trips
 * less before the runs show on a slow connection. Ids other than UUIDs are left out, so nothing of
 * the address reaches the document unless it is one.
 */
export function pageReads(path: string, search: URLSearchParams): string[] {
  const reads: string[] = [firstReads.me];
  const eventId = EVENT_DAY.exec(path)?.[1];
  if (eventId && UUID.test(eventId)) {
    reads.push(firstReads.cars, firstReads.event(eventId));
    const carId = search.get('carId');
    if (carId && UUID.test(carId)) reads.push(firstReads.setups(carId), firstReads.runs({ carId, eventId }));
  }
  return reads;
}

/** `pageReads` as the document's `<link>` tags. */
export function pageReadTags(path: string, search: URLSearchParams): string {
  return pageReads(path, search)
    .map((href) => `<link rel="preload" as="fetch" crossorigin href="${href.replaceAll('&', '&amp;')}">`)
    .join('');
}
