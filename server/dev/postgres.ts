import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { Client } from 'pg';

const PG_BIN = '/usr/lib/postgresql/15/bin';
const SUPERUSER = 'trimsheet';

export interface PostgresOptions {
  dataDir: string;
  port: number;
  /** Extra server settings, e.g. fsync=off for throw-away test clusters. */
  settings?: Record<string, string>;
}

export interface RunningPostgres {
  /** Connection URL of a database on this cluster. */
  url(database: string): string;
  stop(): void;
}

const isRoot = () => typeof process.getuid === 'function' && process.getuid() === 0;

/** PostgreSQL refuses to run as root, so as root its tools run as the postgres system user. */
function pgTool(tool: string, args: string[]) {
  const command = path.join(PG_BIN, tool);
  const [file, argv] = isRoot() ? ['runuser', ['-u', 'postgres', '--', command, ...args]] : [command, args];
  return execFileSync(file, argv, { stdio: ['ignore', 'pipe', 'pipe'] }).toString();
}

/** As root, hand the data folder to postgres and let it pass through the parent folders. */
function prepareDataDir(dataDir: string) {
  fs.mkdirSync(dataDir, { recursive: true, mode: 0o700 });
  if (!isRoot()) return;
  execFileSync('chown', ['-R', 'postgres:postgres', dataDir]);
  for (let dir = path.dirname(dataDir); dir !== path.dirname(dir); dir = path.dirname(dir)) {
    const mode = fs.statSync(dir).mode;
    if ((mode & 0o001) === 0) fs.chmodSync(dir, mode | 0o001);
  }
}

function isRunning(dataDir: string) {
  try {
    pgTool('pg_ctl', ['status', '-D', dataDir]);
    return true;
  } catch {
    return false;
  }
}

/**
 * Starts (initialising if needed) a PostgreSQL 15 cluster on 127.0.0.1:port with its data in dataDir.
 * A cluster already running on that folder is reused and left running.
 */
export function startPostgres({ dataDir, port, settings = {} }: PostgresOptions): RunningPostgres {
  prepareDataDir(dataDir);
  if (!fs.existsSync(path.join(dataDir, 'PG_VERSION'))) {
    pgTool('initdb', ['-A', 'trust', '-U', SUPERUSER, '-E', 'UTF8', '--locale=C.UTF-8', '-D', dataDir]);
  }
  const url = (database: string) => `postgres://${SUPERUSER}@127.0.0.1:${port}/${database}`;
  if (isRunning(dataDir)) return { url, stop: () => undefined };

  // Sockets in /tmp: the default /var/run/postgresql may not exist, and socket paths must stay short.
  const options = [`-h 127.0.0.1`, `-p ${port}`, `-k /tmp`, ...Object.entries(settings).map(([k, v]) => `-c ${k}=${v}`)];
  const logFile = path.join(dataDir, 'server.log');
  try {
    pgTool('pg_ctl', ['start', '-w', '-D', dataDir, '-l', logFile, '-o', options.join(' ')]);
  } catch {
    const lastLines = fs.readFileSync(logFile, 'utf8').trim().split('\n').slice(-3).join('\n');
    throw new Error(`PostgreSQL did not start on port ${port} (is the port in use? set TRIMSHEET_PG_PORT):\n${lastLines}`);
  }
  return {
    url,
    stop: () => {
      if (isRunning(dataDir)) pgTool('pg_ctl', ['stop', '-m', 'fast', '-w', '-D', dataDir]);
    },
  };
}

/** Creates a database if it does not exist, optionally as a copy of a template database. */
export async function ensureDatabase(adminUrl: string, name: string, template?: string): Promise<void> {
  const client = new Client({ connectionString: adminUrl });
  await client.connect();
  try {
    const found = await client.query('SELECT 1 FROM pg_database WHERE datname = $1', [name]);
    if (found.rowCount === 0) {
      await client.query(`CREATE DATABASE "${name}"${template ? ` TEMPLATE "${template}"` : ''}`);
    }
  } finally {
    await client.end();
  }
}
