// Gzipped JavaScript each route loads, from the Vite build manifest: the entry, then
// the route's lazy chunk and everything both import statically. Run after a build:
//   npx vite build && node --import tsx scripts/bundle-size.ts
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { ROOT } from './lib/env';

interface Chunk {
  file: string;
  src?: string;
  isEntry?: boolean;
  imports?: string[];
  dynamicImports?: string[];
}

const dist = join(ROOT, 'dist');
const manifest = JSON.parse(readFileSync(join(dist, '.vite', 'manifest.json'), 'utf8')) as Record<string, Chunk>;
const gz = (file: string) => gzipSync(readFileSync(join(dist, file))).length;

function closure(keys: string[], seen = new Set<string>()): Set<string> {
  for (const key of keys) {
    if (seen.has(key) || !manifest[key]) continue;
    seen.add(key);
    closure(manifest[key].imports ?? [], seen);
  }
  return seen;
}

const entry = Object.keys(manifest).find((k) => manifest[k]!.isEntry)!;
const layout = 'src/app/routes/signed-in-layout.tsx';
/** Routes a driver opens, with the chunks each needs on first load. */
export const ROUTES: Record<string, string[]> = {
  'sign-in': [entry, 'src/app/routes/sign-in.tsx'],
  home: [entry, layout, 'src/app/routes/home.tsx'],
  'event day (trackside)': [entry, layout, 'src/app/routes/events/event-day.tsx'],
  'season review': [entry, layout, 'src/app/routes/analysis/season-review.tsx'],
  calculators: [entry, layout, 'src/app/routes/calculators/calculators.tsx'],
};
export const TRACKSIDE_BUDGET_BYTES = 150 * 1024;

let failed = false;
for (const [route, keys] of Object.entries(ROUTES)) {
  const files = [...closure(keys)].map((k) => manifest[k]!.file).filter((f) => f.endsWith('.js'));
  const total = files.reduce((n, f) => n + gz(f), 0);
  const over = route.startsWith('event day') && total > TRACKSIDE_BUDGET_BYTES;
  failed ||= over;
  console.log(`${route.padEnd(24)} ${(total / 1024).toFixed(1).padStart(7)} KB gzipped in ${files.length} files${over ? '  OVER the 150 KB budget' : ''}`);
}
process.exit(failed ? 1 : 0);
