// Runs a project-local PostgreSQL cluster from Debian's packages: found (or installed) here,
// listening on loopback only, with its socket inside its data directory.
import { execFileSync, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');

const databaseUser = 'restday';
const isRoot = process.getuid?.() === 0;

export interface ClusterOptions {
  /** Where the cluster lives; falls back under /tmp when the postgres user cannot reach it. */
  dataDir: string;
  /** 0 picks a free port when the cluster starts. */
  port: number;
  /** The setting that changes the port, named when the port is taken. */
  portVariable: string;
  /** Throwaway clusters for tests trade durability for speed. */
  durable: boolean;
}

export interface RunningCluster {
  dataDir: string;
  port: number;
  /** True when this process started the server (and so should stop it). */
  startedHere: boolean;
  urlFor(database: string): string;
  stop(): void;
}

export class PostgresSetupError extends Error {}

export function devClusterOptions(env: NodeJS.ProcessEnv = process.env): ClusterOptions {
  return {
    dataDir: env.RESTDAY_PG_DATA ?? path.join(projectRoot, '.data', 'postgres'),
    port: Number(env.RESTDAY_PG_PORT ?? 54329),
    portVariable: 'RESTDAY_PG_PORT',
    durable: true,
  };
}

export function testClusterOptions(env: NodeJS.ProcessEnv = process.env): ClusterOptions {
  return {
    dataDir: env.RESTDAY_TEST_PG_DATA ?? path.join(projectRoot, '.data', 'postgres-test'),
    // Any free port: a second checkout's tests on the same machine must not collide with these.
    port: Number(env.RESTDAY_TEST_PG_PORT ?? 0),
    portVariable: 'RESTDAY_TEST_PG_PORT',
    durable: false,
  };
}

export function findPostgresBinaries(): string {
  const base = '/usr/lib/postgresql';
  const versions = existsSync(base)
    ? readdirSync(base)
        .filter((name) => existsSync(path.join(base, name, 'bin', 'postgres')))
        .sort((a, b) => Number(b) - Number(a))
    : [];
  if (versions[0]) return path.join(base, versions[0], 'bin');

  const installCommand = 'apt-get update && apt-get install -y postgresql';
  if (!isRoot) {
    throw new PostgresSetupError(`PostgreSQL is not installed. Install Debian's package as root, then try again:\n  sudo sh -c '${installCommand}'`);
  }
  console.log('PostgreSQL is missing; installing it from Debian packages (about a minute)…');
  const install = spawnSync('sh', ['-c', installCommand], {
    stdio: 'inherit',
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
  if (install.status !== 0) throw new PostgresSetupError(`"${installCommand}" failed`);
  return findPostgresBinaries();
}

/** As root, PostgreSQL's programs must run as the postgres user. */
function run(bin: string, program: string, args: string[], options: { allowFailure?: boolean } = {}) {
  const command = isRoot ? 'runuser' : path.join(bin, program);
  const fullArgs = isRoot ? ['-u', 'postgres', '--', path.join(bin, program), ...args] : args;
  const result = spawnSync(command, fullArgs, { encoding: 'utf8' });
  if (result.status !== 0 && !options.allowFailure) {
    throw new PostgresSetupError(`${program} ${args.join(' ')} failed:\n${result.stderr || result.stdout}`);
  }
  return result;
}

function postgresCanEnter(dir: string): boolean {
  if (!isRoot) return true;
  return spawnSync('runuser', ['-u', 'postgres', '--', 'test', '-x', dir]).status === 0;
}

/** The postgres user must be able to traverse every parent; a clone under a private home can't be. */
function resolveDataDir(requested: string): string {
  const parent = path.dirname(requested);
  mkdirSync(parent, { recursive: true });
  if (postgresCanEnter(parent)) return requested;
  const key = createHash('sha256').update(requested).digest('hex').slice(0, 12);
  const fallback = path.join('/tmp', `restday-pg-${key}`, path.basename(requested));
  mkdirSync(path.dirname(fallback), { recursive: true, mode: 0o755 });
  return fallback;
}

function isRunning(bin: string, dataDir: string): boolean {
  if (!existsSync(path.join(dataDir, 'PG_VERSION'))) return false;
  return run(bin, 'pg_ctl', ['status', '-D', dataDir], { allowFailure: true }).status === 0;
}

function initCluster(bin: string, dataDir: string) {
  mkdirSync(dataDir, { recursive: true, mode: 0o700 });
  if (isRoot) execFileSync('chown', ['postgres:postgres', dataDir]);
  // Trust on loopback only: the socket sits in the private data dir and TCP binds 127.0.0.1.
  run(bin, 'initdb', ['-D', dataDir, '-U', databaseUser, '--auth=trust', '-E', 'UTF8', '--locale=C.UTF-8']);
}

/** postmaster.pid's fourth line is the port the running server listens on. */
function runningPort(dataDir: string): number {
  const port = Number(readFileSync(path.join(dataDir, 'postmaster.pid'), 'utf8').split('\n')[3]);
  if (!Number.isInteger(port) || port <= 0) throw new PostgresSetupError(`Cannot read the port of the cluster in ${dataDir}`);
  return port;
}

function freePort(): number {
  // A synchronous probe keeps cluster start-up a plain sequence of commands.
  const probe = spawnSync(
    process.execPath,
    ['-e', "const s=require('net').createServer().listen(0,'127.0.0.1',()=>{console.log(s.address().port);s.close()})"],
    {
      encoding: 'utf8',
    },
  );
  const port = Number(probe.stdout.trim());
  if (!Number.isInteger(port) || port <= 0) throw new PostgresSetupError('Could not find a free port for PostgreSQL');
  return port;
}

export function startCluster(options: ClusterOptions): RunningCluster {
  const bin = findPostgresBinaries();
  const dataDir = resolveDataDir(options.dataDir);
  const cluster = (port: number, startedHere: boolean): RunningCluster => ({
    dataDir,
    port,
    startedHere,
    urlFor: (database) => `postgres://${databaseUser}@127.0.0.1:${port}/${database}`,
    stop: () => stopCluster(bin, dataDir),
  });

  if (isRunning(bin, dataDir)) return cluster(runningPort(dataDir), false);
  if (!existsSync(path.join(dataDir, 'PG_VERSION'))) initCluster(bin, dataDir);

  const port = options.port || freePort();
  const settings = [
    `-p ${port}`,
    `-k ${dataDir}`,
    '-c listen_addresses=127.0.0.1',
    ...(options.durable ? [] : ['-c fsync=off', '-c synchronous_commit=off', '-c full_page_writes=off']),
  ].join(' ');
  const logFile = path.join(dataDir, 'server.log');
  const started = run(bin, 'pg_ctl', ['start', '-w', '-t', '30', '-D', dataDir, '-l', logFile, '-o', settings], {
    allowFailure: true,
  });
  if (started.status !== 0) {
    throw new PostgresSetupError(`PostgreSQL did not start on 127.0.0.1:${port} (is the port taken? set ${options.portVariable}). See ${logFile}`);
  }
  return cluster(port, true);
}

function stopCluster(bin: string, dataDir: string) {
  if (isRunning(bin, dataDir)) run(bin, 'pg_ctl', ['stop', '-w', '-m', 'fast', '-D', dataDir], { allowFailure: true });
}

export function createDatabaseIfMissing(cluster: RunningCluster, database: string, options: { recreate?: boolean } = {}) {
  const bin = findPostgresBinaries();
  const connection = ['-h', '127.0.0.1', '-p', String(cluster.port), '-U', databaseUser];
  if (options.recreate) run(bin, 'dropdb', [...connection, '--if-exists', '--force', database]);
  const exists = run(bin, 'psql', [...connection, '-d', 'postgres', '-tAc', `select 1 from pg_database where datname = '${database}'`]);
  if (exists.stdout.trim() !== '1') run(bin, 'createdb', [...connection, database]);
}

// `tsx dev-services/postgres.ts start|stop|status` for the npm scripts db:start and db:stop.
if (process.argv[1] && fileURLToPath(import.meta.url) === path.resolve(process.argv[1])) {
  const command = process.argv[2];
  try {
    const options = devClusterOptions();
    if (command === 'start') {
      const cluster = startCluster(options);
      createDatabaseIfMissing(cluster, 'restday');
      console.log(`PostgreSQL ${cluster.startedHere ? 'started' : 'already running'}: ${cluster.urlFor('restday')}`);
    } else if (command === 'stop') {
      const bin = findPostgresBinaries();
      stopCluster(bin, resolveDataDir(options.dataDir));
      console.log('PostgreSQL stopped.');
    } else {
      console.error('usage: tsx dev-services/postgres.ts start|stop');
      process.exitCode = 2;
    }
  } catch (error) {
    console.error(error instanceof Error ? error.message : error);
    process.exitCode = 1;
  }
}
