// npm run files:check [-- --remove-orphans]: compares the attachment files in storage (UPLOAD_DIR, or the
// S3 bucket when S3_BUCKET is set) with the app's database (the private cluster under .data/pg, or
// DATABASE_URL when set). Run it after restoring a backup, or to find space taken by unreachable files.
import { join } from 'node:path';
import { createDataSource } from '../server/db/data-source';
import { checkStoredFiles, DEFAULT_GRACE_MS } from '../server/files/file-check';
import { queueForRemoval, sweepAllStoredFiles } from '../server/files/file-sweep';
import { storageFromConfig } from '../server/files/storage-config';
import { DATA_DIR, say } from './lib/env';
import { startCluster } from './lib/pg-cluster';

const args = process.argv.slice(2);
if (args.some((a) => a !== '--remove-orphans')) {
  console.error('usage: npm run files:check [-- --remove-orphans]');
  process.exit(2);
}
const removeOrphans = args.includes('--remove-orphans');
/** "1 object", "3 objects". */
const count = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;
const env = process.env;
const cluster = env.DATABASE_URL ? null : await startCluster({ dir: join(DATA_DIR, 'pg'), port: 0, database: 'scrubline', log: say });
const ds = createDataSource(env.DATABASE_URL ?? cluster!.url);
let exitCode = 0;
try {
  await ds.initialize();
  if (await ds.showMigrations()) {
    throw new Error('the database is older than this code: start the app once (npm start) to migrate it, then check again');
  }
  const storage = await storageFromConfig({
    UPLOAD_DIR: env.UPLOAD_DIR,
    S3_BUCKET: env.S3_BUCKET,
    S3_REGION: env.S3_REGION,
    S3_ENDPOINT: env.S3_ENDPOINT,
    S3_ACCESS_KEY_ID: env.S3_ACCESS_KEY_ID,
    S3_SECRET_ACCESS_KEY: env.S3_SECRET_ACCESS_KEY,
  });
  const check = await checkStoredFiles(ds, storage);
  const where = storage.kind === 's3' ? `the bucket ${env.S3_BUCKET}` : (env.UPLOAD_DIR ?? '.data/uploads');
  say(`${count(check.objects, 'stored object', 'stored objects')} in ${where}`);
  say(`${check.queued} already queued for removal; ${check.recent} written in the last ${DEFAULT_GRACE_MS / 60_000} minutes, not judged yet`);
  const list = (keys: string[]) => keys.slice(0, 20).map((k) => `    ${k}`).join('\n') + (keys.length > 20 ? `\n    … and ${keys.length - 20} more` : '');
  if (check.missing.length > 0) {
    exitCode = 1;
    say(`${count(check.missing.length, 'file the database lists is', 'files the database lists are')} not stored (downloads answer 404); restore from the files' backup:`);
    console.log(list(check.missing.map((m) => `${m.key}  (attachment ${m.attachmentId})`)));
  } else {
    say('every file the database lists is stored');
  }
  if (check.orphans.length === 0) {
    say('no stored object is left without its record');
  } else if (removeOrphans) {
    const queued = await queueForRemoval(ds, check.orphans);
    const swept = await sweepAllStoredFiles(ds, storage);
    say(`${count(check.orphans.length, 'object had', 'objects had')} no record: ${queued} queued, ${swept.removed} removed, ${swept.failed} refused by the storage (they stay queued)`);
  } else {
    say(`${count(check.orphans.length, 'object has', 'objects have')} no record (nothing can reach them); remove with npm run files:check -- --remove-orphans:`);
    console.log(list(check.orphans));
  }
} catch (err) {
  console.error(err instanceof Error ? err.message : err);
  exitCode = 1;
} finally {
  if (ds.isInitialized) await ds.destroy();
  // Leave a cluster that `npm start` is using running.
  if (cluster?.startedHere) cluster.stop();
}
process.exit(exitCode);
