// Gzipped JavaScript each route loads, from the Vite build manifest: the entry, then the route's lazy
// chunk and everything both import statically. Needs a build (`vite build`) in dist/. Sizes are those
// of the copies the server sends: the budget is on the gzip ones; browsers that take Brotli (all
// current ones) get the Brotli copies, reported beside it.
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { ROOT } from './env';
import { readBuildManifest, staticClosure } from '../../server/lib/build-manifest';

const LAYOUT = 'src/app/routes/signed-in-layout.tsx';
/** Routes a driver opens, with the source modules each needs on first load (besides the entry). */
export const ROUTES: Record<string, string[]> = {
  'sign-in': ['src/app/routes/sign-in.tsx'],
  home: [LAYOUT, 'src/app/routes/home.tsx'],
  'event day (trackside)': [LAYOUT, 'src/app/routes/events/event-day.tsx'],
  'season review': [LAYOUT, 'src/app/routes/analysis/season-review.tsx'],
  calculators: [LAYOUT, 'src/app/routes/calculators/calculators.tsx'],
};
export const TRACKSIDE_ROUTE = 'event day (trackside)';
export const TRACKSIDE_BUDGET_BYTES = 150 * 1024;

export interface RouteSize {
  route: string;
  bytes: number;
  /** What is sent to a browser that takes Brotli: the .br copies the build wrote (vite.config.ts, precompress). */
  brotliBytes: number;
  files: number;
  /** Over its budget (only the trackside route has one). */
  over: boolean;
}

export function routeSizes(dist = join(ROOT, 'dist')): RouteSize[] {
  const manifest = readBuildManifest(dist);
  // What the server sends: vite.config.ts writes a gzip copy (level 9) and a Brotli copy of each file,
  // except where the copy would be larger (a tiny file), which then goes as it is.
  const sent = (file: string, ext: 'gz' | 'br') => {
    const copy = join(dist, `${file}.${ext}`);
    return readFileSync(existsSync(copy) ? copy : join(dist, file)).length;
  };
  const entry = Object.keys(manifest).find((k) => manifest[k]!.isEntry)!;
  return Object.entries(ROUTES).map(([route, keys]) => {
    const files = [...staticClosure(manifest, [entry, ...keys])].map((k) => manifest[k]!.file).filter((f) => f.endsWith('.js'));
    const bytes = files.reduce((n, f) => n + sent(f, 'gz'), 0);
    const brotliBytes = files.reduce((n, f) => n + sent(f, 'br'), 0);
    return { route, bytes, brotliBytes, files: files.length, over: route === TRACKSIDE_ROUTE && bytes > TRACKSIDE_BUDGET_BYTES };
  });
}

export function formatSizes(sizes: RouteSize[]): string {
  return sizes
    .map(
      (s) =>
        `${s.route.padEnd(24)} ${(s.bytes / 1024).toFixed(1).padStart(7)} KB gzipped (${(s.brotliBytes / 1024).toFixed(1)} KB as sent, Brotli) in ${s.files} files${s.over ? '  OVER the 150 KB budget' : ''}`,
    )
    .join('\n');
}
