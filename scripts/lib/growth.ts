// Growth for the read-path bench: many more drivers, each with a season like the demo
// roadster's, written with set-based SQL; and the query plans behind one request, taken
// from the running server's own statements by PostgreSQL's auto_explain module.
import { openSync, readSync, closeSync, statSync } from 'node:fs';
import type pg from 'pg';
import { DEMO_ACCOUNTS } from '../../server/db/demo-accounts';

/* ---------------------------------------------------------------------------------------------
 * growDrivers
 * ------------------------------------------------------------------------------------------- */

/** The car whose season every grown driver gets a copy of: the demo driver's roadster. */
const SOURCE_CAR_NAME = 'Pebble';
/** Grown accounts are driver-00001@growth.example.com, … (example.com is reserved, RFC 2606). */
const GROWN_DOMAIN = 'growth.example.com';
const grownEmailSql = (n: string) => `'driver-' || lpad((${n})::text, 5, '0') || '@${GROWN_DOMAIN}'`;

export interface GrowOptions {
  /**
   * How many grown drivers share one set of events. Left out (the default), every grown driver
   * runs at the demo season's own events, so the demo car's events fill up with other cars as
   * the database grows: the hardest case for keeping that car's season flat, since every
   * event-scoped lookup then has the grown runs beside it. With a number, drivers 1…k run at
   * the demo events, the next k at a copy of them made by another club (named "… · club 2"),
   * and so on, so the events table grows instead.
   */
  driversPerEventSet?: number;
}

export interface GrowResult {
  /** Grown drivers in the database before and after the call. */
  before: number;
  after: number;
  ms: number;
}

type Client = pg.PoolClient;

const quoteIdent = (name: string) => `"${name.replace(/"/g, '""')}"`;

/** The table's columns in order (generated columns left out). */
async function columnsOf(c: Client, table: string): Promise<string[]> {
  const { rows } = await c.query<{ column_name: string }>(
    `SELECT column_name FROM information_schema.columns
      WHERE table_schema = current_schema() AND table_name = $1 AND is_generated = 'NEVER'
      ORDER BY ordinal_position`,
    [table],
  );
  if (rows.length === 0) throw new Error(`growth: no table ${table}`);
  return rows.map((r) => r.column_name);
}

/**
 * INSERT INTO `table` every column of the source row `s` (joined in `from`), except those
 * given in `set`, which are SQL expressions. Listing the columns from the catalogue keeps the
 * copy whole when a later migration adds one.
 */
async function copyRows(c: Client, table: string, from: string, set: Record<string, string>, params: unknown[]): Promise<number> {
  const columns = await columnsOf(c, table);
  for (const key of Object.keys(set)) if (!columns.includes(key)) throw new Error(`growth: ${table} has no column ${key}`);
  const values = columns.map((col) => set[col] ?? `s.${quoteIdent(col)}`);
  const res = await c.query(`INSERT INTO ${table} (${columns.map(quoteIdent).join(', ')}) SELECT ${values.join(', ')} ${from}`, params);
  return res.rowCount ?? 0;
}

/** A temporary old → new id map per grown driver: (n, old_id, new_id). */
async function idMap(c: Client, name: string, sourceIds: string, params: unknown[]): Promise<void> {
  await c.query(
    `CREATE TEMP TABLE ${name} ON COMMIT DROP AS
       SELECT g.n, src.id AS old_id, gen_random_uuid() AS new_id FROM grow_driver g CROSS JOIN (${sourceIds}) src`,
    params,
  );
  await c.query(`ALTER TABLE ${name} ADD PRIMARY KEY (n, old_id)`);
  await c.query(`ANALYZE ${name}`);
}

/**
 * Adds drivers until the database holds `targetDrivers` grown drivers (call it with 10, then
 * 100, then 1000). Each is an account (password as the demo driver's) owning a copy of the
 * demo roadster with its whole season under fresh ids: setup snapshots and corners, the change
 * log, runs with hot and cold pressures, the tyre set with its mountings and tread readings,
 * the shop's grant and service visits (work orders with lines, measurements and the build
 * sheet), plus a comment thread per event and on about a quarter of the runs. Runs keep their
 * recorded times, so each is tied to the copy of the same snapshot (the tie is by time); raw
 * times differ from the demo's by up to ±0.3 s.
 *
 * The demo car's co-driver's runs go to a co-driver of the copy: driver n co-drives the car
 * of driver n + 1 (the demo co-driver co-drives driver 1's), so every grown account owns one
 * car and co-drives at most one more.
 *
 * One transaction per call; then VACUUM (ANALYZE), the state autovacuum would leave the
 * tables in, so the planner sees the grown row counts.
 */
export async function growDrivers(pool: pg.Pool, targetDrivers: number, options: GrowOptions = {}): Promise<GrowResult> {
  const started = performance.now();
  const perSet = options.driversPerEventSet ?? null;
  if (perSet !== null && !(Number.isInteger(perSet) && perSet > 0)) throw new Error('growth: driversPerEventSet must be a positive whole number');
  const c = await pool.connect();
  let before = 0;
  try {
    await c.query('BEGIN');
    const found = await c.query<{ car_id: string; owner_id: string; co_driver_id: string | null; password_hash: string; grown: number }>(
      `SELECT c.id AS car_id, u.id AS owner_id, u.password_hash,
              (SELECT d.user_id FROM car_co_drivers d WHERE d.car_id = c.id ORDER BY d.created_at, d.user_id LIMIT 1) AS co_driver_id,
              (SELECT count(*)::int FROM users WHERE email LIKE $3) AS grown
         FROM users u JOIN cars c ON c.owner_id = u.id
        WHERE u.email = $1 AND c.name = $2
        ORDER BY c.created_at LIMIT 1`,
      [DEMO_ACCOUNTS.driver.email, SOURCE_CAR_NAME, `driver-%@${GROWN_DOMAIN}`],
    );
    const src = found.rows[0];
    if (!src) throw new Error(`growth: the demo driver's car "${SOURCE_CAR_NAME}" was not found; seed the demo season first`);
    before = src.grown;
    if (targetDrivers <= before) {
      await c.query('ROLLBACK');
      return { before, after: before, ms: performance.now() - started };
    }

    // The source car, its owner and co-driver: the ids every copy maps from.
    await c.query(
      `CREATE TEMP TABLE grow_source ON COMMIT DROP AS SELECT $1::uuid AS car_id, $2::uuid AS owner_id, $3::uuid AS co_driver_id`,
      [src.car_id, src.owner_id, src.co_driver_id],
    );
    const SOURCE_CAR = '(SELECT car_id FROM grow_source)';
    const person = (col: string) =>
      `CASE ${col} WHEN (SELECT owner_id FROM grow_source) THEN g.user_id WHEN (SELECT co_driver_id FROM grow_source) THEN g.co_driver_id ELSE ${col} END`;

    // ---------- the drivers, their accounts and cars ----------
    await c.query(
      `CREATE TEMP TABLE grow_driver (n int PRIMARY KEY, user_id uuid NOT NULL, car_id uuid NOT NULL, co_driver_id uuid, event_set int NOT NULL)
       ON COMMIT DROP`,
    );
    await c.query(
      `INSERT INTO grow_driver (n, user_id, car_id, event_set)
       SELECT n, gen_random_uuid(), gen_random_uuid(), CASE WHEN $3::int IS NULL THEN 0 ELSE (n - 1) / $3::int END
         FROM generate_series($1::int, $2::int) n`,
      [before + 1, targetDrivers, perSet],
    );
    await c.query(
      `UPDATE grow_driver g SET co_driver_id = CASE WHEN $1::uuid IS NULL THEN NULL ELSE COALESCE(
         (SELECT p.user_id FROM grow_driver p WHERE p.n = g.n - 1),
         (SELECT u.id FROM users u WHERE u.email = ${grownEmailSql('g.n - 1')}),
         $1::uuid) END`,
      [src.co_driver_id],
    );
    await c.query('ANALYZE grow_driver');
    await c.query(
      `INSERT INTO users (id, email, display_name, password_hash)
       SELECT g.user_id, ${grownEmailSql('g.n')}, 'Club Driver ' || g.n, $1 FROM grow_driver g`,
      [src.password_hash],
    );
    await copyRows(c, 'cars', 'FROM grow_driver g CROSS JOIN cars s WHERE s.id = $1', {
      id: 'g.car_id', owner_id: 'g.user_id', name: `s.name || ' ' || g.n`, car_number: `(100 + g.n % 900)::text`,
    }, [src.car_id]);
    await c.query(
      `INSERT INTO car_co_drivers (car_id, user_id) SELECT g.car_id, g.co_driver_id FROM grow_driver g WHERE g.co_driver_id IS NOT NULL`,
    );
    await copyRows(c, 'shop_grants', `FROM grow_driver g CROSS JOIN shop_grants s WHERE s.car_id = ${SOURCE_CAR}`, {
      car_id: 'g.car_id', granted_by: person('s.granted_by'),
    }, []);

    // ---------- events: the demo ones (set 0), or another club's copy of them ----------
    await c.query(`CREATE TEMP TABLE grow_event (event_set int, old_id uuid, new_id uuid, PRIMARY KEY (event_set, old_id)) ON COMMIT DROP`);
    await c.query(
      `INSERT INTO grow_event
       SELECT 0, e.id, e.id FROM events e
        WHERE e.id IN (SELECT event_id FROM runs WHERE car_id = $1
                       UNION SELECT t.event_id FROM tread_readings t JOIN tyre_sets ts ON ts.id = t.tyre_set_id WHERE ts.car_id = $1)`,
      [src.car_id],
    );
    if (perSet !== null) {
      // Each further set's events are made by its first driver; a later call finds them by that, name and date.
      await c.query(
        `CREATE TEMP TABLE grow_set ON COMMIT DROP AS
         SELECT DISTINCT g.event_set, COALESCE(f.user_id, u.id) AS creator
           FROM grow_driver g
           LEFT JOIN grow_driver f ON f.n = g.event_set * $1::int + 1
           LEFT JOIN users u ON u.email = ${grownEmailSql('g.event_set * $1::int + 1')}
          WHERE g.event_set > 0`,
        [perSet],
      );
      await c.query(
        `INSERT INTO grow_event
         SELECT gs.event_set, o.id, COALESCE(e.id, gen_random_uuid())
           FROM grow_set gs CROSS JOIN grow_event z JOIN events o ON o.id = z.old_id
           LEFT JOIN events e ON e.created_by = gs.creator AND e.date = o.date AND e.name = o.name || ' · club ' || (gs.event_set + 1)
          WHERE z.event_set = 0`,
      );
      await copyRows(c, 'events',
        `FROM grow_event ge JOIN grow_set gs ON gs.event_set = ge.event_set JOIN events s ON s.id = ge.old_id
          WHERE ge.event_set > 0 AND NOT EXISTS (SELECT 1 FROM events x WHERE x.id = ge.new_id)`, {
          id: 'ge.new_id', created_by: 'gs.creator', name: `s.name || ' · club ' || (gs.event_set + 1)`, team_id: 'NULL',
          created_at: 'now()', updated_at: 'now()',
        }, []);
    }
    await c.query('ANALYZE grow_event');
    const eventOf = (col: string) => `(SELECT ge.new_id FROM grow_event ge WHERE ge.event_set = g.event_set AND ge.old_id = ${col})`;

    // ---------- setups, the shop's visits, the change log ----------
    await idMap(c, 'grow_setup', 'SELECT id FROM setup_snapshots WHERE car_id = $1', [src.car_id]);
    await idMap(c, 'grow_work_order', 'SELECT id FROM work_orders WHERE car_id = $1', [src.car_id]);
    const mapped = (map: string, col: string) => `(SELECT x.new_id FROM ${map} x WHERE x.n = g.n AND x.old_id = ${col})`;
    // Snapshots and work orders point at each other: snapshots first without theirs, then set it.
    await copyRows(c, 'setup_snapshots', 'FROM grow_setup m JOIN grow_driver g ON g.n = m.n JOIN setup_snapshots s ON s.id = m.old_id', {
      id: 'm.new_id', car_id: 'g.car_id', created_by: person('s.created_by'), derived_from_id: mapped('grow_setup', 's.derived_from_id'),
      work_order_id: 'NULL', suggestion_id: 'NULL',
    }, []);
    await copyRows(c, 'setup_corners', 'FROM grow_setup m JOIN setup_corners s ON s.setup_id = m.old_id', { setup_id: 'm.new_id' }, []);
    await copyRows(c, 'work_orders', 'FROM grow_work_order m JOIN grow_driver g ON g.n = m.n JOIN work_orders s ON s.id = m.old_id', {
      id: 'm.new_id', car_id: 'g.car_id', opened_by: person('s.opened_by'), closed_by: person('s.closed_by'),
      setup_id: mapped('grow_setup', 's.setup_id'),
    }, []);
    await c.query(
      `UPDATE setup_snapshots t SET work_order_id = w.new_id
         FROM grow_setup m JOIN setup_snapshots s ON s.id = m.old_id JOIN grow_work_order w ON w.n = m.n AND w.old_id = s.work_order_id
        WHERE t.id = m.new_id`,
    );
    await copyRows(c, 'work_order_lines', 'FROM grow_work_order m JOIN work_order_lines s ON s.work_order_id = m.old_id', {
      id: 'gen_random_uuid()', work_order_id: 'm.new_id',
    }, []);
    for (const table of ['work_order_stages', 'work_order_measurements', 'build_sheet_corners']) {
      await copyRows(c, table, `FROM grow_work_order m JOIN ${table} s ON s.work_order_id = m.old_id`, { work_order_id: 'm.new_id' }, []);
    }
    await copyRows(c, 'change_log', `FROM grow_driver g CROSS JOIN change_log s WHERE s.car_id = ${SOURCE_CAR}`, {
      id: 'gen_random_uuid()', car_id: 'g.car_id', created_by: person('s.created_by'),
      setup_id: mapped('grow_setup', 's.setup_id'), work_order_id: mapped('grow_work_order', 's.work_order_id'),
    }, []);

    // ---------- runs and pressures ----------
    await idMap(c, 'grow_run', 'SELECT id FROM runs WHERE car_id = $1', [src.car_id]);
    await copyRows(c, 'runs', 'FROM grow_run m JOIN grow_driver g ON g.n = m.n JOIN runs s ON s.id = m.old_id', {
      id: 'm.new_id', car_id: 'g.car_id', event_id: eventOf('s.event_id'), driver_id: person('s.driver_id'),
      raw_time_sec: 'CASE WHEN s.raw_time_sec IS NULL THEN NULL ELSE round((s.raw_time_sec + (random() - 0.5) * 0.6)::numeric, 3)::float8 END',
    }, []);
    await copyRows(c, 'pressure_readings', `FROM grow_driver g CROSS JOIN pressure_readings s WHERE s.car_id = ${SOURCE_CAR}`, {
      id: 'gen_random_uuid()', car_id: 'g.car_id', run_id: mapped('grow_run', 's.run_id'), created_by: person('s.created_by'),
    }, []);

    // ---------- tyres ----------
    await idMap(c, 'grow_tyre_set', 'SELECT id FROM tyre_sets WHERE car_id = $1', [src.car_id]);
    await copyRows(c, 'tyre_sets', 'FROM grow_tyre_set m JOIN grow_driver g ON g.n = m.n JOIN tyre_sets s ON s.id = m.old_id', {
      id: 'm.new_id', car_id: 'g.car_id',
    }, []);
    await copyRows(c, 'tyre_mountings', 'FROM grow_tyre_set m JOIN tyre_mountings s ON s.tyre_set_id = m.old_id', {
      id: 'gen_random_uuid()', tyre_set_id: 'm.new_id',
    }, []);
    await idMap(c, 'grow_tread',
      'SELECT t.id FROM tread_readings t JOIN tyre_sets ts ON ts.id = t.tyre_set_id WHERE ts.car_id = $1', [src.car_id]);
    await copyRows(c, 'tread_readings',
      `FROM grow_tread m JOIN grow_driver g ON g.n = m.n JOIN tread_readings s ON s.id = m.old_id
         JOIN grow_tyre_set ts ON ts.n = m.n AND ts.old_id = s.tyre_set_id`, {
        id: 'm.new_id', tyre_set_id: 'ts.new_id', event_id: `CASE WHEN s.event_id IS NULL THEN NULL ELSE ${eventOf('s.event_id')} END`,
        created_by: person('s.created_by'),
      }, []);
    await copyRows(c, 'tread_reading_corners', 'FROM grow_tread m JOIN tread_reading_corners s ON s.reading_id = m.old_id', {
      reading_id: 'm.new_id',
    }, []);

    // ---------- comments: a thread per event the car ran at, and on about one run in four ----------
    await c.query(
      `INSERT INTO comments (id, car_id, event_id, author_id, body, created_at)
       SELECT gen_random_uuid(), g.car_id, ge.new_id, g.user_id, 'Course walked twice; slalom after the start is tight, stay wide.',
              e.date + time '18:00'
         FROM grow_driver g JOIN grow_event ge ON ge.event_set = g.event_set JOIN events e ON e.id = ge.new_id`,
    );
    await c.query(
      `INSERT INTO comments (id, car_id, run_id, author_id, body, created_at)
       SELECT gen_random_uuid(), r.car_id, r.id, COALESCE(g.co_driver_id, g.user_id), 'Pushed on the exit of the last sweeper.',
              r.recorded_at + interval '10 minutes'
         FROM grow_run m JOIN grow_driver g ON g.n = m.n JOIN runs r ON r.id = m.new_id
        WHERE random() < 0.25`,
    );

    await c.query('COMMIT');
  } catch (err) {
    await c.query('ROLLBACK').catch(() => undefined);
    throw err;
  } finally {
    c.release();
  }
  await pool.query('VACUUM (ANALYZE)');
  return { before, after: targetDrivers, ms: performance.now() - started };
}

/**
 * Rows per table, largest first (the statistics' live-row counts, exact after the VACUUM
 * (ANALYZE) that growDrivers ends with).
 */
export async function rowCounts(pool: pg.Pool, top = 12): Promise<{ table: string; rows: number }[]> {
  const { rows } = await pool.query<{ table: string; rows: number }>(
    `SELECT relname AS "table", n_live_tup::int AS rows FROM pg_stat_user_tables ORDER BY n_live_tup DESC, relname LIMIT $1`,
    [top],
  );
  return rows;
}

/* ---------------------------------------------------------------------------------------------
 * Query plans of one request
 * ------------------------------------------------------------------------------------------- */

/*
 * PostgreSQL's auto_explain module logs the plan of every statement the server runs, with
 * EXPLAIN ANALYZE's actual times and row counts when auto_explain.log_analyze is on
 * (https://www.postgresql.org/docs/15/auto-explain.html). It is loaded into every new
 * connection through session_preload_libraries, so that has to be set before the app server
 * opens its pool. It stays idle (log_min_duration = -1) until a capture switches it on for the
 * whole cluster with ALTER SYSTEM and pg_reload_conf(); each backend applies the reloaded
 * settings before the next command it reads.
 */

export interface PlanCapture {
  /** A pool on the cluster, as a superuser (the private cluster's own user is one). */
  pool: pg.Pool;
  /** The cluster's server log: server.log in the folder given to startCluster. */
  logFile: string;
}

export interface QueryPlan {
  /** The backend that ran it. */
  pid: number;
  /** The statement as sent ($n parameters unfilled), whitespace collapsed. */
  query: string;
  /** auto_explain's duration: the executor's time for the statement, with instrumentation, ms. */
  durationMs: number;
  /** The EXPLAIN ANALYZE plan, as text. */
  plan: string;
  /**
   * Shared buffers the statement hit in memory and read, from its top node (0 when buffers are
   * not logged). Unlike times, these do not depend on how busy the machine is: they are the
   * work a plan does, so they show whether a query grows with the database.
   */
  sharedHit: number;
  sharedRead: number;
}

export interface RequestQueries<T> {
  result: T;
  /** Statements the request ran (SELECT, INSERT, UPDATE, DELETE; BEGIN/COMMIT are not planned). */
  statements: number;
  plans: QueryPlan[];
  /** Shared buffers (hit + read) over all its statements. */
  sharedBuffers: number;
}

const AUTO_EXPLAIN_SETTINGS: [string, string][] = [
  ['auto_explain.log_min_duration', '-1'],
  ['auto_explain.log_analyze', 'on'],
  ['auto_explain.log_timing', 'on'],
  ['auto_explain.log_format', 'text'],
];

/**
 * Loads auto_explain into every connection made from now on, idle until a capture. Call it
 * before the app server starts, so that its pool's connections have the module. Buffer counts
 * are logged unless `buffers` is false.
 */
export async function enableQueryPlans(pool: pg.Pool, opts: { buffers?: boolean } = {}): Promise<void> {
  const c = await pool.connect();
  try {
    // Loading it here first makes its settings known to ALTER SYSTEM.
    await c.query(`LOAD 'auto_explain'`);
    await c.query(`ALTER SYSTEM SET session_preload_libraries = 'auto_explain'`);
    for (const [name, value] of [...AUTO_EXPLAIN_SETTINGS, ['auto_explain.log_buffers', opts.buffers === false ? 'off' : 'on']]) {
      await c.query(`ALTER SYSTEM SET ${name} = '${value}'`);
    }
    await c.query('SELECT pg_reload_conf()');
  } finally {
    c.release();
  }
}

/** Takes the settings enableQueryPlans made out of postgresql.auto.conf again. */
export async function disableQueryPlans(pool: pg.Pool): Promise<void> {
  const c = await pool.connect();
  try {
    await c.query(`LOAD 'auto_explain'`);
    await c.query('ALTER SYSTEM RESET session_preload_libraries');
    for (const [name] of [...AUTO_EXPLAIN_SETTINGS, ['auto_explain.log_buffers']]) await c.query(`ALTER SYSTEM RESET ${name}`);
    await c.query('SELECT pg_reload_conf()');
  } finally {
    c.release();
  }
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Sets auto_explain.log_min_duration cluster-wide and waits until this backend has reloaded it. */
async function setMinDuration(c: Client, value: '0' | '-1') {
  await c.query(`ALTER SYSTEM SET auto_explain.log_min_duration = '${value}'`);
  await c.query('SELECT pg_reload_conf()');
  const want = value === '0' ? '0' : '-1';
  for (let i = 0; i < 100; i++) {
    const { rows } = await c.query<{ v: string }>(`SELECT current_setting('auto_explain.log_min_duration') AS v`);
    if (rows[0]?.v === want || rows[0]?.v === `${want}ms`) break;
    await sleep(20);
  }
  // The postmaster signals every backend at once; a little more time for the others to see it.
  await sleep(100);
}

function readFrom(file: string, offset: number): string {
  const size = statSync(file).size;
  if (size <= offset) return '';
  const buf = Buffer.alloc(size - offset);
  const fd = openSync(file, 'r');
  try {
    readSync(fd, buf, 0, buf.length, offset);
  } finally {
    closeSync(fd);
  }
  return buf.toString('utf8');
}

/** Log entries start with log_line_prefix, by default '%m [%p] ': a timestamp and the backend's pid. */
const ENTRY_START = /^\d{4}-\d\d-\d\d \d\d:\d\d:\d\d(?:\.\d+)? \S+ \[(\d+)\] /;
const PLAN_HEAD = /LOG: {2}duration: ([\d.]+) ms {2}plan:$/;
/** A plan's top node: no indentation, with EXPLAIN's cost estimate. */
const TOP_NODE = /^\S.*\(cost=[\d.]+\.\.[\d.]+ rows=\d+ width=\d+\)/;

/** The auto_explain entries in a stretch of the server log. */
export function parsePlans(log: string): QueryPlan[] {
  const entries: { pid: number; lines: string[] }[] = [];
  for (const line of log.split('\n')) {
    const start = ENTRY_START.exec(line);
    if (start) entries.push({ pid: Number(start[1]), lines: [line.slice(start[0].length)] });
    else if (entries.length) entries.at(-1)!.lines.push(line);
  }
  const plans: QueryPlan[] = [];
  for (const { pid, lines } of entries) {
    const head = PLAN_HEAD.exec(lines[0]!);
    if (!head) continue;
    // The message's own line breaks are followed by a tab in the log.
    const body = lines.slice(1).map((l) => l.replace(/^\t/, ''));
    while (body.length && body.at(-1)!.trim() === '') body.pop();
    let top = body.findIndex((l, i) => i > 0 && TOP_NODE.test(l));
    if (top < 0) top = body.length;
    const query = body.slice(0, top).join(' ').replace(/^Query Text:\s*/, '').replace(/\s+/g, ' ').trim();
    const plan = body.slice(top);
    // The top node's own lines come before its first child ("->").
    const child = plan.findIndex((l) => l.trimStart().startsWith('->'));
    const line = plan.slice(0, child < 0 ? plan.length : child).find((l) => /^\s*Buffers: shared/.test(l)) ?? '';
    const buffers = /shared ([^,]*)/.exec(line)?.[1] ?? '';
    const count = (what: string) => Number(new RegExp(`${what}=(\\d+)`).exec(buffers)?.[1] ?? 0);
    plans.push({ pid, query, durationMs: Number(head[1]), plan: plan.join('\n'), sharedHit: count('hit'), sharedRead: count('read') });
  }
  return plans;
}

/**
 * Runs `request` (an HTTP call to the app server) with auto_explain logging every statement
 * in the cluster, and returns what it answered with, how many statements it ran and their
 * plans. Statements of this function's own connection are left out; anything else the cluster
 * ran meanwhile (another client, the session store's clean-up) would be counted, so make the
 * request alone. enableQueryPlans must have been called before the app server connected.
 */
export async function explainRequestQueries<T>(capture: PlanCapture, request: () => Promise<T>): Promise<RequestQueries<T>> {
  const c = await capture.pool.connect();
  let result: T;
  let log: string;
  let ownPid: number;
  try {
    await c.query(`LOAD 'auto_explain'`);
    ownPid = (await c.query<{ pid: number }>('SELECT pg_backend_pid() AS pid')).rows[0]!.pid;
    await setMinDuration(c, '0');
    const offset = statSync(capture.logFile).size;
    try {
      result = await request();
    } finally {
      await setMinDuration(c, '-1');
    }
    log = readFrom(capture.logFile, offset);
  } finally {
    c.release();
  }
  const plans = parsePlans(log).filter((p) => p.pid !== ownPid);
  if (plans.length === 0) {
    throw new Error('explainRequestQueries: no plans were logged; call enableQueryPlans before the app server opens its connections');
  }
  return { result, statements: plans.length, plans, sharedBuffers: plans.reduce((n, p) => n + p.sharedHit + p.sharedRead, 0) };
}
