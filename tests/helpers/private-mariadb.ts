/**
 * A MariaDB server of one test file alone, for drills that stop and start the database: the
 * project's server (scripts/db.sh) is shared by the test files running beside this one, so it is
 * never stopped. Same Debian binaries as scripts/db.sh, its own data folder, port and socket,
 * root without a password over loopback (the folder is throwaway). `remove()` always ends the
 * server (SIGKILL as a last resort) and deletes the folder.
 */
import { spawn, spawnSync } from 'node:child_process';
import type { ChildProcess } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import { tmpdir } from 'node:os';
import type { DbConfig } from '../../server/config';

function binary(name: string): string {
  for (const dir of ['/usr/sbin', '/usr/bin']) {
    const file = path.join(dir, name);
    if (existsSync(file)) return file;
  }
  return name;
}

/** Whether this machine has the server binaries (scripts/db.sh installs them; a DATABASE_URL run may not). */
export function mariaDbInstalled(): boolean {
  return ['mariadbd', 'mariadb-install-db', 'mariadb-admin', 'mariadb'].every((name) => binary(name) !== name);
}

async function freePort(): Promise<number> {
  const srv = net.createServer();
  await new Promise<void>((resolve) => srv.listen(0, '127.0.0.1', resolve));
  const { port } = srv.address() as net.AddressInfo;
  await new Promise((resolve) => srv.close(resolve));
  return port;
}

/** Every thread of the process is in the stopped state ('T'), or /proc cannot tell (then: assume so). */
function allStopped(pid: number): boolean {
  try {
    return readdirSync(`/proc/${pid}/task`).every((tid) => {
      const stat = readFileSync(`/proc/${pid}/task/${tid}/stat`, 'utf8');
      return stat.slice(stat.lastIndexOf(')') + 2, stat.lastIndexOf(')') + 3) === 'T';
    });
  } catch {
    return true;
  }
}

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

export interface PrivateMariaDb {
  readonly port: number;
  readonly dir: string;
  /** Root over TCP on loopback, database `drill`. */
  db(poolMax?: number): DbConfig;
  /** Starts the server on the same folder and port; resolves once it answers a ping. */
  start(): Promise<void>;
  /**
   * SIGTERM: a clean shutdown, as `mariadb-admin shutdown`; SIGKILL: a crash (InnoDB recovers at
   * the next start). Resolves once the process is gone.
   */
  stop(signal?: 'SIGTERM' | 'SIGKILL'): Promise<void>;
  /**
   * A hung server: the process keeps its sockets but answers nothing. SIGSTOP reaches each thread
   * on its own, so this resolves once every thread shows as stopped (Linux /proc).
   */
  pause(): Promise<void>;
  resume(): void;
  /** SQL through the command-line client over the socket (for set-up and checks outside the app). */
  sql(statement: string): string;
  remove(): Promise<void>;
}

export async function privateMariaDb(label = 'drill'): Promise<PrivateMariaDb> {
  // Under the OS temp folder: the socket path must stay under 107 characters.
  const dir = mkdtempSync(path.join(tmpdir(), `hc-${label}-`));
  const data = path.join(dir, 'data');
  const sock = path.join(dir, 'm.sock');
  mkdirSync(data);
  const install = spawnSync(
    binary('mariadb-install-db'),
    ['--no-defaults', '--user=root', `--datadir=${data}`, '--auth-root-authentication-method=normal', '--skip-test-db'],
    { encoding: 'utf8', timeout: 30_000 },
  );
  if (install.status !== 0) {
    rmSync(dir, { recursive: true, force: true });
    throw new Error(`mariadb-install-db failed: ${install.stderr || install.stdout}`);
  }
  const port = await freePort();
  let child: ChildProcess | null = null;
  let exited: Promise<void> = Promise.resolve();

  const client = (args: string[], input?: string) =>
    spawnSync(binary('mariadb'), ['--no-defaults', '--protocol=socket', `--socket=${sock}`, '-uroot', '--batch', '--skip-column-names', ...args], {
      encoding: 'utf8',
      input,
      timeout: 10_000,
    });
  const ping = () =>
    spawnSync(binary('mariadb-admin'), ['--no-defaults', '--protocol=socket', `--socket=${sock}`, '-uroot', '--connect-timeout=1', 'ping'], {
      encoding: 'utf8',
      timeout: 3_000,
    }).status === 0;

  const server: PrivateMariaDb = {
    port,
    dir,
    db: (poolMax = 4) => ({ host: '127.0.0.1', port, user: 'root', password: '', database: 'drill', poolMax }),
    async start() {
      if (child) throw new Error('private MariaDB already running');
      const proc = spawn(
        binary('mariadbd'),
        [
          '--no-defaults',
          '--user=root',
          `--datadir=${data}`,
          '--bind-address=127.0.0.1',
          `--port=${port}`,
          `--socket=${sock}`,
          `--pid-file=${path.join(dir, 'm.pid')}`,
          `--log-error=${path.join(dir, 'error.log')}`,
          '--character-set-server=utf8mb4',
          '--collation-server=utf8mb4_unicode_ci',
          '--innodb-buffer-pool-size=32M',
          '--innodb-log-file-size=16M',
          '--skip-name-resolve',
          '--skip-log-bin',
          '--performance-schema=OFF',
        ],
        { stdio: 'ignore' },
      );
      child = proc;
      exited = new Promise<void>((resolve) => proc.once('exit', () => resolve()));
      void exited.then(() => {
        if (child === proc) child = null;
      });
      const deadline = Date.now() + 10_000;
      while (Date.now() < deadline) {
        if (!child) throw new Error(`private MariaDB exited at start; see ${path.join(dir, 'error.log')}`);
        if (ping()) break;
        await sleep(100);
      }
      if (!ping()) throw new Error(`private MariaDB did not answer within 10 s; see ${path.join(dir, 'error.log')}`);
      const made = client([], "CREATE DATABASE IF NOT EXISTS drill CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;");
      if (made.status !== 0) throw new Error(`could not create the drill database: ${made.stderr}`);
    },
    async stop(signal = 'SIGTERM') {
      const proc = child;
      if (!proc) return;
      proc.kill(signal);
      proc.kill('SIGCONT');
      const gone = await Promise.race([exited.then(() => true), sleep(15_000).then(() => false)]);
      if (!gone) {
        proc.kill('SIGKILL');
        await exited;
      }
    },
    async pause() {
      const pid = child?.pid;
      if (!pid) throw new Error('private MariaDB is not running');
      process.kill(pid, 'SIGSTOP');
      const deadline = Date.now() + 3000;
      while (Date.now() < deadline && !allStopped(pid)) await sleep(10);
    },
    resume() {
      child?.kill('SIGCONT');
    },
    sql(statement: string) {
      const res = client(['drill'], statement);
      if (res.status !== 0) throw new Error(`SQL failed: ${res.stderr}`);
      return res.stdout;
    },
    async remove() {
      try {
        await server.stop();
      } finally {
        rmSync(dir, { recursive: true, force: true });
      }
    },
  };
  return server;
}
