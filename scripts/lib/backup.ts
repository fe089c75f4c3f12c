// Backups of the database with PostgreSQL's own tools: pg_dump's custom format (compressed,
// restorable table by table) and pg_restore. Both connect with the app's database URL.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, statSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { ensurePgBin } from './pg-cluster';

function run(tool: 'pg_dump' | 'pg_restore', args: string[]): void {
  const res = spawnSync(join(ensurePgBin(), tool), args, { encoding: 'utf8' });
  if (res.status !== 0) throw new Error(`${tool} failed (exit ${res.status}):\n${res.stderr || res.stdout}`);
}

/** Writes the whole database (schema, data, the migrations table) to `file`; answers its size in bytes. */
export function backupDatabase(databaseUrl: string, file: string): number {
  mkdirSync(dirname(file), { recursive: true });
  // No owners or grants: the dump restores into any role's database, as on a new server.
  run('pg_dump', ['--format=custom', '--no-owner', '--no-acl', `--file=${file}`, `--dbname=${databaseUrl}`]);
  return statSync(file).size;
}

/**
 * Replaces what the database holds with the backup in `file`, in one transaction: if anything
 * fails, the database is left as it was. Stop the app first; its sessions are in the database too.
 */
export function restoreDatabase(databaseUrl: string, file: string): void {
  if (!existsSync(file)) throw new Error(`No backup at ${file}`);
  run('pg_restore', ['--clean', '--if-exists', '--no-owner', '--no-acl', '--single-transaction', '--exit-on-error', `--dbname=${databaseUrl}`, file]);
}

/** `.data/backups/scrubline-2026-12-02T05-40-00Z.dump` */
export function backupFileName(dir: string, now = new Date()): string {
  return join(dir, `scrubline-${now.toISOString().replace(/\.\d+Z$/, 'Z').replace(/:/g, '-')}.dump`);
}
