// npm run db:restore -- <file>: replaces the app's database with a backup made by db:backup.
// Stop the app first (Ctrl+C on `npm start`).
import { join, resolve } from 'node:path';
import { restoreDatabase } from './lib/backup';
import { DATA_DIR, say } from './lib/env';
import { startCluster } from './lib/pg-cluster';

if (!process.argv[2]) {
  console.error('usage: npm run db:restore -- <backup file>   (files made by npm run db:backup are in .data/backups/)');
  process.exit(2);
}
const file = resolve(process.argv[2]);
const cluster = process.env.DATABASE_URL ? null : await startCluster({ dir: join(DATA_DIR, 'pg'), port: 0, database: 'scrubline', log: say });
const url = process.env.DATABASE_URL ?? cluster!.url;
try {
  restoreDatabase(url, file);
  say(`restored ${file}; the next npm start migrates it if it is older than the code`);
} finally {
  if (cluster?.startedHere) cluster.stop();
}
