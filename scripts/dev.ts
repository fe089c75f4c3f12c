// `npm run dev`: the private PostgreSQL cluster, the API under tsx watch on
// API_PORT (3000) and Vite with hot reload on 5173, proxying /api to the API.
import { spawn, type ChildProcess } from 'node:child_process';
import { join } from 'node:path';
import { startCluster } from './lib/pg-cluster';
import { DATA_DIR, localSessionSecret, ROOT, say } from './lib/env';

const apiPort = process.env.API_PORT ?? '3000';
const cluster = process.env.DATABASE_URL
  ? undefined
  : await startCluster({ dir: join(DATA_DIR, 'pg'), port: 0, database: 'scrubline', log: say });

const env = {
  ...process.env,
  DATABASE_URL: process.env.DATABASE_URL ?? cluster?.url ?? '',
  SESSION_SECRET: process.env.SESSION_SECRET ?? localSessionSecret(),
  PORT: apiPort,
  API_PORT: apiPort,
};
const bin = (name: string) => join(ROOT, 'node_modules', '.bin', name);
const children: ChildProcess[] = [
  spawn(bin('tsx'), ['watch', '--clear-screen=false', 'server/index.ts'], { cwd: ROOT, env, stdio: 'inherit' }),
  spawn(bin('vite'), ['--host', '127.0.0.1'], { cwd: ROOT, env, stdio: 'inherit' }),
];

let stopping = false;
function stop() {
  if (stopping) return;
  stopping = true;
  for (const child of children) child.kill('SIGTERM');
  cluster?.stop();
  process.exit(0);
}
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
for (const child of children) child.on('exit', stop);
