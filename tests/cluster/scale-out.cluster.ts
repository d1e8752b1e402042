/**
 * Scale-out on a three-node MariaDB Galera cluster (issue 15, first slice): three app instances
 * start at once, each on its own node, each running migrate + demo seed (as
 * `scripts/migrate.ts --seed-demo` does) and then the server. Proves that the schema and the demo
 * are made once cluster-wide, and that a session made through one instance works through another.
 * Then (second slice): a nightly weather run started on every instance at once fetches each cell
 * once and writes no duplicate day, every run is closed with its real figures; and a node killed
 * under writes gives its instance fast 503s (never a hang, a 500 or a crash) while the others
 * carry on, and after it rejoins every committed write is there once, on every node.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { execFileSync, spawn } from 'node:child_process';
import type { ChildProcess } from 'node:child_process';
import { createWriteStream, mkdirSync, readFileSync, readdirSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import net from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import mariadb from 'mariadb';
import type { Sequelize } from 'sequelize';
import { createSequelize } from '../../server/db/sequelize';
import { readEnvFile } from '../../server/config';
import { isConflict, retryOnConflict, withClusterLock } from '../../server/db/migrate';

const root = fileURLToPath(new URL('../..', import.meta.url));
const clusterDir = path.join(root, '.cluster');
const logDir = path.join(clusterDir, 'logs');
const clusterSh = path.join(root, 'scripts', 'cluster.sh');
const INSTANCES = 3;
const DEMO_DOMAIN = '%@hollowbrook.example';
const LOGIN = { email: 'grower.rosa@hollowbrook.example', password: 'heatclock-demo' };

interface Instance {
  n: number;
  dbPort: number;
  httpPort: number;
  /** Exit code of migrate + seed (null while it runs). */
  migrateExit: number | null;
  migrateMs: number;
  server: ChildProcess | null;
  serverExit: number | null;
  log: string;
}

const children = new Set<ChildProcess>();
/** Set once cleanup begins: nothing new is started after it (an instance still migrating would). */
let stopping = false;
const instances: Instance[] = [];
let db: Record<string, string> = {};
let clusterStartMs = 0;
const runStarted = Date.now();

function cluster(cmd: string) {
  return execFileSync('bash', [clusterSh, cmd], { cwd: root, encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'], timeout: 120_000 });
}

async function freePort(): Promise<number> {
  const srv = net.createServer();
  await new Promise<void>((r) => srv.listen(0, '127.0.0.1', r));
  const { port } = srv.address() as net.AddressInfo;
  await new Promise((r) => srv.close(r));
  return port;
}

const sessionSecret = randomBytes(32).toString('hex');

/** A clean environment: nothing of vitest's (NODE_ENV=test) or of the project's single MariaDB. */
function instanceEnv(inst: Instance): NodeJS.ProcessEnv {
  return {
    PATH: process.env.PATH,
    HOME: process.env.HOME,
    TZ: 'UTC',
    NODE_ENV: 'development',
    HOST: '127.0.0.1',
    PORT: String(inst.httpPort),
    DB_HOST: db.DB_HOST,
    DB_PORT: String(inst.dbPort),
    DB_USER: db.DB_USER,
    DB_PASSWORD: db.DB_PASSWORD,
    DB_NAME: db.DB_NAME,
    DB_TEST_NAME: db.DB_NAME,
    // Every instance must read the others' session cookies.
    SESSION_SECRET: sessionSecret,
    UPLOADS_DIR: path.join(clusterDir, 'uploads'),
    WEATHER_MODE: 'fake',
    MAIL_MODE: 'fake',
    MAIL_FAKE_PORT: '0',
    SCHEDULER: 'off',
    LOG_LEVEL: 'warn',
    // A node that stops answering must not hold a request for long (the default is 8000).
    DB_QUERY_TIMEOUT_MS: '4000',
  };
}

function run(inst: Instance, args: string[], label: string): ChildProcess {
  if (stopping) throw new Error('cleanup has begun');
  const out = createWriteStream(inst.log, { flags: 'a' });
  out.write(`\n--- ${label} (${new Date().toISOString()})\n`);
  // Its own process group, so cleanup stops it with whatever it started.
  const child = spawn(process.execPath, ['--import', 'tsx', ...args], { cwd: root, env: instanceEnv(inst), detached: true, stdio: ['ignore', 'pipe', 'pipe'] });
  child.stdout!.pipe(out, { end: false });
  child.stderr!.pipe(out, { end: false });
  children.add(child);
  child.once('exit', () => children.delete(child));
  return child;
}

const exited = (child: ChildProcess) => new Promise<number>((resolve) => child.once('exit', (code, signal) => resolve(code ?? (signal ? 128 : 1))));

async function waitReady(inst: Instance, limitMs: number) {
  const end = Date.now() + limitMs;
  while (Date.now() < end) {
    if (inst.serverExit !== null) throw new Error(`instance ${inst.n} exited with ${inst.serverExit}; see ${inst.log}`);
    try {
      const res = await fetch(`http://127.0.0.1:${inst.httpPort}/api/ready`, { signal: AbortSignal.timeout(2000) });
      if (res.status === 200) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`instance ${inst.n} not ready within ${limitMs} ms; see ${inst.log}`);
}

/** migrate + seed, then the server, as `npm start` does after the database is up. */
async function startInstance(inst: Instance) {
  const t0 = Date.now();
  inst.migrateExit = await exited(run(inst, ['scripts/migrate.ts', '--seed-demo'], 'migrate --seed-demo'));
  inst.migrateMs = Date.now() - t0;
  if (inst.migrateExit !== 0 || stopping) return;
  const server = run(inst, ['server/index.ts'], 'server');
  inst.server = server;
  void exited(server).then((code) => (inst.serverExit = code));
  await waitReady(inst, 60_000);
}

async function stopAll() {
  stopping = true;
  const ending = [...children].map(async (child) => {
    const done = exited(child);
    try {
      process.kill(-child.pid!, 'SIGTERM');
    } catch {
      return;
    }
    const timer = setTimeout(() => {
      try {
        process.kill(-child.pid!, 'SIGKILL');
      } catch {
        // gone
      }
    }, 8000);
    await done;
    clearTimeout(timer);
  });
  await Promise.all(ending);
}

function stopAllNow() {
  stopping = true;
  for (const child of children) {
    try {
      process.kill(-child.pid!, 'SIGKILL');
    } catch {
      // gone
    }
  }
  try {
    cluster('stop');
  } catch {
    // best effort on the way out
  }
}
process.once('SIGINT', () => {
  stopAllNow();
  process.exit(130);
});
process.once('SIGTERM', () => {
  stopAllNow();
  process.exit(143);
});

async function query<T>(port: number, sql: string, values: unknown[] = []): Promise<T[]> {
  const conn = await mariadb.createConnection({ host: '127.0.0.1', port, user: db.DB_USER, password: db.DB_PASSWORD, database: db.DB_NAME, connectTimeout: 3000, bigIntAsNumber: true });
  try {
    // Galera certifies a commit on every node at once but applies it on the others a moment
    // later: a read here waits until this node has applied everything committed before it.
    await conn.query('SET SESSION wsrep_sync_wait = 1');
    return (await conn.query(sql, values)) as T[];
  } finally {
    await conn.end();
  }
}

/** Runs tests/cluster/nightly-run.ts as one more process of instance `inst`; resolves with its JSON answer. */
function instanceScript<T>(inst: Instance, args: string[], extraEnv: Record<string, string> = {}): Promise<T> {
  if (stopping) throw new Error('cleanup has begun');
  const out = createWriteStream(inst.log, { flags: 'a' });
  out.write(`\n--- nightly-run.ts ${args.join(' ')} (${new Date().toISOString()})\n`);
  const child = spawn(process.execPath, ['--import', 'tsx', 'tests/cluster/nightly-run.ts', ...args], {
    cwd: root,
    env: { ...instanceEnv(inst), ...extraEnv },
    detached: true,
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  children.add(child);
  child.once('exit', () => children.delete(child));
  let stdout = '';
  child.stdout!.on('data', (c: Buffer) => {
    stdout += c.toString();
    out.write(c);
  });
  child.stderr!.pipe(out, { end: false });
  return exited(child).then((code) => {
    if (code !== 0) throw new Error(`nightly-run.ts ${args.join(' ')} on instance ${inst.n} exited with ${code}; see ${inst.log}`);
    return JSON.parse(stdout.trim().split('\n').at(-1)!) as T;
  });
}

function nodePid(n: number): number {
  return Number(readFileSync(path.join(clusterDir, `n${n}`, 'mariadbd.pid'), 'utf8').trim());
}

/** As root on node n's socket (what scripts/cluster.sh does): for settings the app's account may not change. */
function asRoot(n: number, sql: string) {
  const sock = path.join(clusterDir, `n${n}`, 's.sock');
  return execFileSync('mariadb', ['--no-defaults', '--protocol=socket', `--socket=${sock}`, '-uroot', '--connect-timeout=2', '-N', '-B', '-e', sql], { encoding: 'utf8', timeout: 10_000 });
}

describe('three app instances on a three-node Galera cluster', () => {
  beforeAll(async () => {
    const t0 = Date.now();
    // A fresh cluster: the proof is that the first start of several instances makes the schema once.
    cluster('reset');
    process.stdout.write(cluster('start'));
    clusterStartMs = Date.now() - t0;
    mkdirSync(logDir, { recursive: true });
    db = readEnvFile(path.join(clusterDir, 'cluster.env'));
    const ports = db.CLUSTER_PORTS.split(',').map(Number);
    for (let n = 1; n <= INSTANCES; n++) {
      instances.push({
        n,
        dbPort: ports[n - 1],
        httpPort: await freePort(),
        migrateExit: null,
        migrateMs: 0,
        server: null,
        serverExit: null,
        log: path.join(logDir, `instance-${n}.log`),
      });
    }
    // All at once, each on its own node; every start is waited for before a failure is told.
    const started = await Promise.allSettled(instances.map((inst) => startInstance(inst)));
    const failed = started.find((r) => r.status === 'rejected');
    if (failed) throw failed.reason;
  }, 180_000);

  afterAll(async () => {
    await stopAll();
    cluster('stop');
    const summary = instances.map((i) => `instance ${i.n} (node :${i.dbPort}) migrate+seed ${(i.migrateMs / 1000).toFixed(1)} s, exit ${i.migrateExit}`).join('\n  ');
    process.stdout.write(
      `\n[cluster test] cluster start ${(clusterStartMs / 1000).toFixed(1)} s; whole run ${((Date.now() - runStarted) / 1000).toFixed(1)} s\n  ${summary}\n  logs: ${logDir}\n`,
    );
  }, 60_000);

  it('when three instances start at once, then none exits with an error', () => {
    for (const inst of instances) {
      expect(inst.migrateExit, `migrate + seed of instance ${inst.n} (${inst.log})`).toBe(0);
      expect(inst.serverExit, `server of instance ${inst.n}`).toBeNull();
    }
  });

  it('when they have started, then every migration is recorded once, on every node', async () => {
    const files = readdirSync(path.join(root, 'server', 'db', 'migrations'))
      .filter((f) => f.endsWith('.ts'))
      .map((f) => f.replace(/\.ts$/, ''))
      .sort();
    for (const inst of instances) {
      const rows = await query<{ name: string; times: number }>(inst.dbPort, 'SELECT name, COUNT(*) AS times FROM schema_migrations GROUP BY name ORDER BY name');
      expect(rows.map((r) => r.name)).toEqual(files);
      expect(rows.every((r) => Number(r.times) === 1)).toBe(true);
    }
  });

  it('when they have started, then the demo is seeded once: 4 accounts, 2 gardens, one membership each', async () => {
    for (const inst of instances) {
      const [users] = await query<{ c: number }>(inst.dbPort, 'SELECT COUNT(*) AS c FROM users WHERE email LIKE ?', [DEMO_DOMAIN]);
      expect(Number(users.c)).toBe(4);
      const [gardens] = await query<{ c: number }>(
        inst.dbPort,
        `SELECT COUNT(DISTINCT g.id) AS c FROM gardens g JOIN memberships m ON m.garden_id = g.id JOIN users u ON u.id = m.user_id
          WHERE u.email = 'coordinator@hollowbrook.example' AND m.role = 'owner'`,
      );
      expect(Number(gardens.c)).toBe(2);
      const [memberships] = await query<{ c: number; pairs: number }>(
        inst.dbPort,
        `SELECT COUNT(*) AS c, COUNT(DISTINCT m.user_id, m.garden_id) AS pairs FROM memberships m JOIN users u ON u.id = m.user_id WHERE u.email LIKE ?`,
        [DEMO_DOMAIN],
      );
      expect(Number(memberships.c)).toBe(8);
      expect(Number(memberships.pairs)).toBe(8);
    }
  });

  it('when the schema is made, then every table has a primary key (Galera needs one)', async () => {
    const missing = await query<{ t: string }>(
      instances[0].dbPort,
      `SELECT t.table_name AS t FROM information_schema.tables t
        WHERE t.table_schema = DATABASE() AND t.table_type = 'BASE TABLE'
          AND NOT EXISTS (SELECT 1 FROM information_schema.table_constraints c
                           WHERE c.table_schema = t.table_schema AND c.table_name = t.table_name AND c.constraint_type = 'PRIMARY KEY')`,
    );
    expect(missing.map((r) => r.t)).toEqual([]);
  });

  it('when a grower signs in through one instance, then the session works through the others', async () => {
    const [first, ...others] = instances;
    const login = await fetch(`http://127.0.0.1:${first.httpPort}/api/auth/login`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', accept: 'application/json' },
      body: JSON.stringify(LOGIN),
    });
    expect(login.status).toBe(200);
    const cookie = login.headers
      .getSetCookie()
      .map((c) => c.split(';')[0])
      .find((c) => c.startsWith('heatclock.sid='));
    expect(cookie).toBeDefined();
    for (const inst of others) {
      const me = await fetch(`http://127.0.0.1:${inst.httpPort}/api/auth/me`, { headers: { cookie: cookie!, accept: 'application/json' } });
      expect(me.status, `GET /api/auth/me through instance ${inst.n}`).toBe(200);
      const body = (await me.json()) as { user: { email: string } };
      expect(body.user.email).toBe(LOGIN.email);
    }
    // And without the cookie the same instance says no: the 200 above is the session's doing.
    const anonymous = await fetch(`http://127.0.0.1:${others[0].httpPort}/api/auth/me`, { headers: { accept: 'application/json' } });
    expect(anonymous.status).toBe(401);
  });

  describe('the cluster-wide lock and the conflict retry, straight on the nodes', () => {
    const pools: Sequelize[] = [];
    const on = (n: number) => {
      const sequelize = createSequelize({ host: '127.0.0.1', port: instances[n - 1].dbPort, user: db.DB_USER, password: db.DB_PASSWORD, database: db.DB_NAME, poolMax: 4 });
      pools.push(sequelize);
      return sequelize;
    };
    afterAll(async () => {
      await Promise.all(pools.map((p) => p.close()));
    });

    it('when instances on three nodes take the same lock at once, then they never hold it together', async () => {
      let inside = 0;
      let most = 0;
      let runs = 0;
      const work = async () => {
        inside++;
        most = Math.max(most, inside);
        await new Promise((r) => setTimeout(r, 150));
        inside--;
        runs++;
      };
      const nodes = [on(1), on(2), on(3)];
      await Promise.all(nodes.flatMap((sequelize) => [1, 2].map(() => withClusterLock(sequelize, 'probe', work, { pollMs: 50, log: () => undefined }))));
      expect(runs).toBe(6);
      expect(most).toBe(1);
    });

    it('when a holder dies without releasing, then another node takes the lock once its lease has run out', async () => {
      const [a, b] = [on(1), on(2)];
      await withClusterLock(a, 'lease', async () => undefined, { log: () => undefined });
      // A holder that stopped renewing: its lease ends in 1.5 s.
      await a.query("UPDATE schema_lock SET holder = 'gone:1:dead', expires_at = NOW(3) + INTERVAL 1500000 MICROSECOND WHERE name = 'lease'");
      const started = Date.now();
      await withClusterLock(b, 'lease', async () => undefined, { pollMs: 100, log: () => undefined });
      expect(Date.now() - started).toBeGreaterThanOrEqual(1000);
      expect(Date.now() - started).toBeLessThan(6000);
    });

    it('when two nodes commit conflicting writes, then the later fails with 1213 and the retry commits', async () => {
      const [a, b] = [on(1), on(3)];
      const bump = 'UPDATE schema_lock SET taken_at = NOW(3) WHERE name = ?';
      const ta = await a.transaction();
      const tb = await b.transaction();
      await a.query(bump, { replacements: ['probe'], transaction: ta });
      await b.query(bump, { replacements: ['probe'], transaction: tb });
      await ta.commit();
      const failure = await tb.commit().then(
        () => null,
        (err: unknown) => err,
      );
      expect(isConflict(failure), String(failure)).toBe(true);
      // The same conflict inside retryOnConflict: the first attempt loses certification, the next commits.
      let attempts = 0;
      await retryOnConflict(
        async () => {
          attempts++;
          await b.transaction(async (transaction) => {
            await b.query(bump, { replacements: ['probe'], transaction });
            if (attempts === 1) await a.query(bump, { replacements: ['probe'] });
          });
        },
        { baseMs: 20 },
      );
      expect(attempts).toBe(2);
    });
  });

  describe('work on every instance at once', () => {
    it('when the nightly run starts on every instance at once, then each cell is fetched once, no day is written twice, and every run is closed with its real figures', async () => {
      const { cellIds } = await instanceScript<{ cellIds: number[] }>(instances[0], ['setup', '14']);
      expect(cellIds).toHaveLength(14);
      const due = await query<{ id: number; latitude: number; longitude: number }>(
        instances[0].dbPort,
        'SELECT id, latitude, longitude FROM weather_cells c WHERE EXISTS (SELECT 1 FROM gardens g WHERE g.weather_cell_id = c.id)',
      );
      const startAt = String(Date.now() + 9000);
      const t0 = Date.now();
      const results = await Promise.all(
        instances.map((inst) =>
          instanceScript<{ run: { cellsOk: number; cellsFailed: number; claimConflicts: number }; row: { status: string; cellsOk: number; claimConflicts: number }; fetched: Array<[number, number]> }>(
            inst,
            ['nightly'],
            { START_AT: startAt },
          ),
        ),
      );
      process.stdout.write(
        `[cluster test] nightly on 3 instances: ${((Date.now() - t0) / 1000).toFixed(1)} s; ok ${results.map((r) => r.run.cellsOk).join('/')}, claim conflicts ${results.map((r) => r.run.claimConflicts).join('/')}\n`,
      );
      const fetched = results.flatMap((r) => r.fetched.map(([lat, lon]) => `${lat},${lon}`));
      for (const cell of due) {
        expect(fetched.filter((f) => f === `${cell.latitude},${cell.longitude}`), `cell ${cell.id}`).toHaveLength(1);
      }
      expect(fetched).toHaveLength(due.length);
      for (const r of results) {
        expect(r.run.cellsFailed).toBe(0);
        // What the run recorded is what it did: its cells, and its lost claims counted apart.
        expect(r.row).toMatchObject({ status: 'ok', cellsOk: r.run.cellsOk, claimConflicts: r.run.claimConflicts });
        expect(r.run.cellsOk).toBe(r.fetched.length);
      }
      expect(results.reduce((n, r) => n + r.run.cellsOk, 0)).toBe(due.length);
      for (const inst of instances) {
        const [dupes] = await query<{ total: number; distinctDays: number }>(inst.dbPort, 'SELECT COUNT(*) AS total, COUNT(DISTINCT cell_id, date) AS distinctDays FROM weather_days');
        expect(Number(dupes.total)).toBe(Number(dupes.distinctDays));
        const [open] = await query<{ c: number }>(inst.dbPort, "SELECT COUNT(*) AS c FROM job_runs WHERE status = 'running'");
        expect(Number(open.c)).toBe(0);
        const [leased] = await query<{ c: number }>(inst.dbPort, 'SELECT COUNT(*) AS c FROM weather_cells WHERE lease_owner IS NOT NULL');
        expect(Number(leased.c)).toBe(0);
      }
    }, 120_000);

    it('when alert evaluation runs on every instance at once, then each alert is made once and each message is sent once', async () => {
      const { gardenIds } = await instanceScript<{ gardenIds: number[] }>(instances[0], ['alerts-setup']);
      const startAt = String(Date.now() + 9000);
      const results = await Promise.all(
        instances.map((inst) => instanceScript<{ evaluated: number; opened: number; retried: number }>(inst, ['alerts', gardenIds.join(',')], { START_AT: startAt })),
      );
      process.stdout.write(`[cluster test] alerts on 3 instances: opened ${results.map((r) => r.opened).join('/')}, conflicts retried ${results.map((r) => r.retried).join('/')}\n`);
      const ids = gardenIds.join(',');
      // Each node is read with causal reads (see query): what any process committed is there.
      for (const inst of instances) {
        const alerts = await query<{ id: number; k: string }>(inst.dbPort, `SELECT id, CONCAT(garden_id, ':', subject_key, ':', type, ':', first_on) AS k FROM alerts WHERE garden_id IN (${ids})`);
        expect(alerts.length, 'the demo gardens have alerts to make').toBeGreaterThan(0);
        expect(new Set(alerts.map((a) => a.k)).size).toBe(alerts.length);
        // Each alert was opened by exactly one of the three evaluations.
        expect(results.reduce((n, r) => n + r.opened, 0)).toBe(alerts.length);
        const outbox = await query<{ id: number; status: string; dedupe: string }>(inst.dbPort, `SELECT id, status, dedupe_key AS dedupe FROM mail_outbox WHERE garden_id IN (${ids})`);
        expect(outbox.length, 'alert mail was queued').toBeGreaterThan(0);
        expect(outbox.filter((o) => o.status !== 'sent')).toEqual([]);
        const captured = await query<{ h: string }>(inst.dbPort, "SELECT headers_json AS h FROM captured_mail WHERE headers_json LIKE '%outbox.%'");
        for (const o of outbox) {
          const copies = captured.filter((c) => c.h.includes(`<outbox.${o.id}.`));
          expect(copies, `message ${o.id} (${o.dedupe})`).toHaveLength(1);
        }
      }
    }, 120_000);

    it('when a node is killed under writes, then its instance answers fast 503s, the others carry on, and after it rejoins every committed write is there once', async () => {
      const login = await fetch(`http://127.0.0.1:${instances[0].httpPort}/api/auth/login`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', accept: 'application/json' },
        body: JSON.stringify(LOGIN),
      });
      const cookie = login.headers
        .getSetCookie()
        .map((c) => c.split(';')[0])
        .find((c) => c.startsWith('heatclock.sid='))!;
      const headers = { cookie, accept: 'application/json', 'content-type': 'application/json', 'x-requested-with': 'heatclock-cluster' };
      const gardens = (await (await fetch(`http://127.0.0.1:${instances[0].httpPort}/api/gardens`, { headers })).json()) as { gardens: Array<{ id: number; role?: string }> };
      const gardenId = gardens.gardens[0].id;
      const tag = randomBytes(3).toString('hex');
      interface Sent { name: string; status: number; ms: number; at: number }
      const sent: Sent[][] = instances.map(() => []);
      let writing = true;
      const writer = async (inst: Instance, i: number) => {
        for (let k = 0; writing; k++) {
          const name = `Kill ${tag} ${inst.n}-${k}`;
          const t = Date.now();
          let status = 0;
          try {
            const res = await fetch(`http://127.0.0.1:${inst.httpPort}/api/gardens/${gardenId}/beds`, {
              method: 'POST',
              headers: { ...headers, 'idempotency-key': `${tag}-${inst.n}-${k}` },
              body: JSON.stringify({ name, kind: 'bed', lengthM: 2, widthM: 1 }),
              signal: AbortSignal.timeout(15_000),
            });
            status = res.status;
            await res.arrayBuffer();
          } catch {
            status = -1; // no answer within 15 s, or the connection failed: a hang or a crash
          }
          sent[i].push({ name, status, ms: Date.now() - t, at: t });
          await new Promise((r) => setTimeout(r, 60));
        }
      };
      const writers = instances.map((inst, i) => writer(inst, i));
      await new Promise((r) => setTimeout(r, 2500));
      const killedAt = Date.now();
      process.kill(nodePid(3), 'SIGKILL');
      // The survivors hold commits until they agree the node is gone: that takes Galera's
      // evs.suspect_timeout (5 s by default) after its last message, longer on a loaded machine.
      // Wait for the new view of two nodes, then keep writing for a few seconds more.
      let viewAt = 0;
      while (Date.now() - killedAt < 60_000) {
        await new Promise((r) => setTimeout(r, 250));
        const size = asRoot(1, "SELECT VARIABLE_VALUE FROM information_schema.GLOBAL_STATUS WHERE VARIABLE_NAME = 'WSREP_CLUSTER_SIZE'").trim();
        if (size === '2') {
          viewAt = Date.now();
          break;
        }
      }
      expect(viewAt, 'the survivors form a cluster of two').toBeGreaterThan(0);
      await new Promise((r) => setTimeout(r, Math.max(4000, killedAt + 7000 - Date.now())));
      writing = false;
      await Promise.all(writers);
      const pause = Math.max(...[0, 1].flatMap((i) => sent[i].filter((s) => s.at + s.ms >= killedAt).map((s) => s.ms)));
      process.stdout.write(`[cluster test] node killed: survivors' view of two after ${((viewAt - killedAt) / 1000).toFixed(1)} s; their slowest write ${(pause / 1000).toFixed(1)} s\n`);

      const afterKill = (i: number) => sent[i].filter((s) => s.at > killedAt + 500);
      // A request in flight at the kill may have committed (201) or not (503); none is a 500 or left hanging.
      const caught = sent[2].filter((s) => s.at + s.ms >= killedAt);
      expect(caught.filter((s) => s.status !== 201 && s.status !== 503), JSON.stringify(caught)).toEqual([]);
      const victim = afterKill(2);
      expect(victim.length, 'requests to the instance of the killed node').toBeGreaterThan(3);
      expect(victim.filter((s) => s.status !== 503), JSON.stringify(victim)).toEqual([]);
      expect(Math.max(...victim.map((s) => s.ms)), 'slowest 503').toBeLessThan(5000);
      expect(instances[2].serverExit, 'the instance of the killed node keeps running').toBeNull();
      for (const i of [0, 1]) {
        const theirs = afterKill(i);
        expect(theirs.filter((s) => s.status !== 201 && s.status !== 503), `instance ${i + 1}: ${JSON.stringify(theirs)}`).toEqual([]);
        // Carrying on: once the survivors see the node gone, every write lands.
        const later = sent[i].filter((s) => s.at > viewAt + 500);
        expect(later.length, `instance ${i + 1} writes after the new view`).toBeGreaterThanOrEqual(5);
        expect(later.filter((s) => s.status !== 201), `instance ${i + 1}: ${JSON.stringify(later)}`).toEqual([]);
      }
      const ready = await fetch(`http://127.0.0.1:${instances[2].httpPort}/api/ready`);
      expect(ready.status).toBe(503);

      // The node rejoins (state transfer from a survivor) and its instance is ready again.
      const t0 = Date.now();
      cluster('start');
      await waitReady(instances[2], 60_000);
      process.stdout.write(`[cluster test] killed node back and its instance ready in ${((Date.now() - t0) / 1000).toFixed(1)} s\n`);
      const committed = sent.flat().filter((s) => s.status === 201).map((s) => s.name);
      expect(committed.length).toBeGreaterThan(10);
      for (const inst of instances) {
        const rows = await query<{ name: string; times: number }>(inst.dbPort, 'SELECT name, COUNT(*) AS times FROM beds WHERE garden_id = ? AND name LIKE ? GROUP BY name', [gardenId, `Kill ${tag} %`]);
        const times = new Map(rows.map((r) => [r.name, Number(r.times)]));
        expect(committed.filter((n) => times.get(n) !== 1), `node :${inst.dbPort}`).toEqual([]);
        expect(rows.filter((r) => Number(r.times) !== 1)).toEqual([]);
      }
      const back = await fetch(`http://127.0.0.1:${instances[2].httpPort}/api/gardens/${gardenId}/beds`, { headers });
      expect(back.status).toBe(200);
    }, 150_000);

    it('when a node is desynced (as while it donates a state transfer), then its instance is not ready, and ready again once it is Synced', async () => {
      const inst = instances[1];
      asRoot(2, 'SET GLOBAL wsrep_desync = ON');
      try {
        const res = await fetch(`http://127.0.0.1:${inst.httpPort}/api/ready`);
        expect(res.status).toBe(503);
        expect(res.headers.get('retry-after')).toBe('5');
        expect(((await res.json()) as { node: string }).node).toMatch(/Desynced|Donor/);
      } finally {
        asRoot(2, 'SET GLOBAL wsrep_desync = OFF');
      }
      await waitReady(inst, 20_000);
      const ok = (await (await fetch(`http://127.0.0.1:${inst.httpPort}/api/ready`)).json()) as { status: string; node: string };
      expect(ok).toMatchObject({ status: 'ready', node: 'Synced' });
    });

    it('when a node freezes (SIGSTOP, like a partition), then its instance answers 503 within the statement bound instead of hanging, and serves again after it thaws', async () => {
      const inst = instances[1];
      const login = await fetch(`http://127.0.0.1:${inst.httpPort}/api/auth/login`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', accept: 'application/json' },
        body: JSON.stringify(LOGIN),
      });
      expect(login.status).toBe(200);
      const cookie = login.headers
        .getSetCookie()
        .map((c) => c.split(';')[0])
        .find((c) => c.startsWith('heatclock.sid='))!;
      const pid = nodePid(2);
      const answers: Array<{ status: number; ms: number }> = [];
      process.kill(pid, 'SIGSTOP');
      try {
        const end = Date.now() + 12_000;
        while (Date.now() < end) {
          const t = Date.now();
          let status = -1;
          try {
            const res = await fetch(`http://127.0.0.1:${inst.httpPort}/api/gardens`, { headers: { cookie, accept: 'application/json' }, signal: AbortSignal.timeout(15_000) });
            status = res.status;
            await res.arrayBuffer();
          } catch {
            // no answer within 15 s: a hang
          }
          answers.push({ status, ms: Date.now() - t });
        }
        const ready = await fetch(`http://127.0.0.1:${inst.httpPort}/api/ready`, { signal: AbortSignal.timeout(5000) });
        expect(ready.status).toBe(503);
      } finally {
        process.kill(pid, 'SIGCONT');
      }
      process.stdout.write(`[cluster test] frozen node: ${answers.map((a) => `${a.status} in ${(a.ms / 1000).toFixed(1)} s`).join(', ')}\n`);
      expect(answers.filter((a) => a.status !== 503), JSON.stringify(answers)).toEqual([]);
      // DB_QUERY_TIMEOUT_MS is 4000 here: the silent connection is dropped 2 s after it, plus slack for this busy machine.
      expect(Math.max(...answers.map((a) => a.ms))).toBeLessThan(9000);
      expect(inst.serverExit).toBeNull();
      await waitReady(inst, 90_000);
      const back = await fetch(`http://127.0.0.1:${inst.httpPort}/api/gardens`, { headers: { cookie, accept: 'application/json' } });
      expect(back.status).toBe(200);
    }, 150_000);
  });
});

