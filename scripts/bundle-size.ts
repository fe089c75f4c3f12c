// Gzipped JavaScript each route loads on first visit; fails when the trackside route is over budget.
//   npx vite build && node --import tsx scripts/bundle-size.ts
import { formatSizes, routeSizes } from './lib/bundle-size';

const sizes = routeSizes();
console.log(formatSizes(sizes));
process.exit(sizes.some((s) => s.over) ? 1 : 0);
