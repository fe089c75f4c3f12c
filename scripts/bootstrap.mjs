// Entry point for `npm start` and `npm test`. Runs on plain Node.js, before any
// dependency is installed: it installs what is missing, then hands over to the
// TypeScript script of the same name through tsx.
import { spawnSync, spawn } from 'node:child_process';
import { existsSync, statSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const command = process.argv[2];
if (!['start', 'test', 'dev', 'bench', 'db-backup', 'db-restore', 'files-check'].includes(command)) {
  console.error('usage: node scripts/bootstrap.mjs start|test|dev|bench|db-backup|db-restore|files-check');
  process.exit(2);
}

function needsInstall() {
  const modules = join(root, 'node_modules');
  const marker = join(modules, '.package-lock.json');
  if (!existsSync(modules) || !existsSync(marker)) return true;
  return statSync(marker).mtimeMs < statSync(join(root, 'package-lock.json')).mtimeMs;
}

if (needsInstall()) {
  console.log('[scrubline] installing dependencies (npm ci)…');
  const result = spawnSync('npm', ['ci', '--no-audit', '--no-fund'], { cwd: root, stdio: 'inherit' });
  if (result.status !== 0) {
    console.error('[scrubline] npm ci failed; see the output above.');
    process.exit(result.status ?? 1);
  }
}

// One Node.js process with tsx's loader (no watcher process in between), so a
// signal reaches the script itself and it can stop PostgreSQL before exiting.
const child = spawn(process.execPath, ['--import', 'tsx', join(root, 'scripts', `${command}.ts`), ...process.argv.slice(3)], {
  cwd: root,
  stdio: 'inherit',
});
// Ctrl+C reaches the whole process group; a signal sent to this wrapper alone is
// passed on. The script ignores repeats, cleans up and exits; then so do we.
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => child.kill(signal));
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
