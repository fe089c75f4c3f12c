// npm run db:backup [-- <file>]: a pg_dump of the app's database (the private cluster under
// .data/pg, or DATABASE_URL when set) into .data/backups/ or the file given.
import { join, resolve } from 'node:path';
import { backupDatabase, backupFileName } from './lib/backup';
import { DATA_DIR, say } from './lib/env';
import { startCluster } from './lib/pg-cluster';

const cluster = process.env.DATABASE_URL ? null : await startCluster({ dir: join(DATA_DIR, 'pg'), port: 0, database: 'scrubline', log: say });
const url = process.env.DATABASE_URL ?? cluster!.url;
const file = process.argv[2] ? resolve(process.argv[2]) : backupFileName(join(DATA_DIR, 'backups'));
try {
  const bytes = backupDatabase(url, file);
  say(`backup written: ${file} (${(bytes / 1024).toFixed(0)} KB)`);
  say(`restore it with: npm run db:restore -- ${file}`);
} finally {
  // Leave a cluster that `npm start` is using running.
  if (cluster?.startedHere) cluster.stop();
}
