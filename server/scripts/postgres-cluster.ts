import { execFileSync, spawnSync } from 'node:child_process';
import { chownSync, existsSync, mkdirSync, readdirSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import path from 'node:path';

/** A running local PostgreSQL cluster started by this project. */
export interface LocalCluster {
  /** postgres://… URL of the project's database on loopback. */
  url: string;
  port: number;
  /** Stops the server (fast shutdown); removes the folder too when it was throwaway. */
  stop: () => void;
  /** Fault tests: stops the server (fast shutdown, every connection ends) and keeps the data. */
  stopServer: () => void;
  /** Fault tests: starts the stopped server again on the same port. */
  startServer: () => void;
}

const PG_ROOT = '/usr/lib/postgresql';

/** Finds Debian's PostgreSQL server binaries, installing the `postgresql` package when they are missing. */
export function ensurePostgresBinaries(log: (line: string) => void = console.error): string {
  const found = findBinDir();
  if (found) return found;
  if (process.getuid?.() !== 0) {
    throw new Error('PostgreSQL server binaries are missing. Install them with: sudo apt-get install -y postgresql (or set DATABASE_URL).');
  }
  log('PostgreSQL server binaries missing: installing Debian package "postgresql" (apt-get)…');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
  execFileSync('apt-get', ['install', '-y', '-qq', 'postgresql'], { stdio: 'inherit', env });
  const bin = findBinDir();
  if (!bin) throw new Error('apt-get installed postgresql but no server binaries were found under /usr/lib/postgresql.');
  return bin;
}

function findBinDir(): string | null {
  if (!existsSync(PG_ROOT)) return null;
  const versions = readdirSync(PG_ROOT)
    .filter((v) => existsSync(path.join(PG_ROOT, v, 'bin', 'initdb')))
    .sort((a, b) => Number(b) - Number(a));
  return versions.length ? path.join(PG_ROOT, versions[0], 'bin') : null;
}

/** Asks the kernel for a free loopback port. */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const addr = srv.address();
      const port = typeof addr === 'object' && addr ? addr.port : 0;
      srv.close(() => resolve(port));
    });
  });
}

export interface ClusterOptions {
  /** Folder that holds data/, sock/ and server.log. */
  dir: string;
  /** Database to create if missing. */
  database: string;
  /** Throwaway test cluster: durability settings off, folder deleted on stop. */
  throwaway?: boolean;
  log?: (line: string) => void;
}

/**
 * Starts (initialising on first use) a PostgreSQL cluster in `dir`, listening on 127.0.0.1 only.
 * initdb and pg_ctl refuse to run as root, so as root they run as the `postgres` user.
 */
export async function startLocalCluster(opts: ClusterOptions): Promise<LocalCluster> {
  const log = opts.log ?? console.error;
  const bin = ensurePostgresBinaries(log);
  const asRoot = process.getuid?.() === 0;
  const dataDir = path.join(opts.dir, 'data');
  const sockDir = path.join(opts.dir, 'sock');
  mkdirSync(sockDir, { recursive: true });
  if (asRoot) {
    const uid = Number(execFileSync('id', ['-u', 'postgres']).toString().trim());
    const gid = Number(execFileSync('id', ['-g', 'postgres']).toString().trim());
    chownSync(opts.dir, uid, gid);
    chownSync(sockDir, uid, gid);
    if (existsSync(dataDir)) chownSync(dataDir, uid, gid);
  }
  const run = (cmd: string, args: string[]) => {
    const full = asRoot ? ['runuser', ['-u', 'postgres', '--', path.join(bin, cmd), ...args]] as const : [path.join(bin, cmd), args] as const;
    const res = spawnSync(full[0], full[1] as string[], { encoding: 'utf8' });
    if (res.status !== 0) throw new Error(`${cmd} failed (${res.status}): ${res.stderr || res.stdout}`);
    return res.stdout;
  };

  if (!existsSync(path.join(dataDir, 'PG_VERSION'))) {
    run('initdb', ['-D', dataDir, '-U', 'postgres', '--auth=trust', '-E', 'UTF8', '--locale=C.UTF-8', '--no-instructions', ...(opts.throwaway ? ['--no-sync'] : [])]);
  }
  // A cluster left running by a killed process would hold the lock: stop it first.
  spawnSync(asRoot ? 'runuser' : path.join(bin, 'pg_ctl'), asRoot ? ['-u', 'postgres', '--', path.join(bin, 'pg_ctl'), '-D', dataDir, '-m', 'fast', 'stop'] : ['-D', dataDir, '-m', 'fast', 'stop'], { encoding: 'utf8' });

  const port = await freePort();
  const serverOpts = [`-c listen_addresses=127.0.0.1`, `-p ${port}`, `-k ${sockDir}`];
  if (opts.throwaway) serverOpts.push('-c fsync=off', '-c synchronous_commit=off', '-c full_page_writes=off');
  const startServer = () => run('pg_ctl', ['-D', dataDir, '-l', path.join(opts.dir, 'server.log'), '-w', '-t', '30', '-o', serverOpts.join(' '), 'start']);
  startServer();

  const exists = spawnSync(path.join(bin, 'psql'), ['-h', '127.0.0.1', '-p', String(port), '-U', 'postgres', '-tAc', `SELECT 1 FROM pg_database WHERE datname='${opts.database}'`], { encoding: 'utf8' });
  if (exists.stdout.trim() !== '1') {
    execFileSync(path.join(bin, 'createdb'), ['-h', '127.0.0.1', '-p', String(port), '-U', 'postgres', opts.database]);
  }

  let stopped = false;
  const stop = () => {
    if (stopped) return;
    stopped = true;
    try {
      run('pg_ctl', ['-D', dataDir, '-m', 'fast', '-w', 'stop']);
    } catch (err) {
      log(`PostgreSQL stop: ${(err as Error).message}`);
    }
    if (opts.throwaway) rmSync(opts.dir, { recursive: true, force: true });
  };
  return {
    url: `postgres://postgres@127.0.0.1:${port}/${opts.database}`,
    port,
    stop,
    stopServer: () => run('pg_ctl', ['-D', dataDir, '-m', 'fast', '-w', 'stop']),
    startServer,
  };
}
