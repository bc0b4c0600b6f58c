import { spawn, type ChildProcess } from 'node:child_process';
import crypto from 'node:crypto';
import net from 'node:net';
import path from 'node:path';
import { Client } from 'pg';

const root = path.resolve(__dirname, '..', '..', '..');

/** A port nobody listens on now, for a process the test starts itself. */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = net.createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const address = probe.address();
      probe.close(() => (typeof address === 'object' && address ? resolve(address.port) : reject(new Error('no port'))));
    });
  });
}

/** Runs SQL on a database through its own short-lived connection. */
export async function queryDatabase<Row extends object = Record<string, unknown>>(
  databaseUrl: string,
  sql: string,
  values: unknown[] = [],
): Promise<Row[]> {
  const client = new Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    return (await client.query<Row>(sql, values)).rows;
  } finally {
    await client.end();
  }
}

/** A Trimsheet API process started the way production starts it (server/index.ts), on a port of its own. */
export interface ApiProcess {
  url: string;
  child: ChildProcess;
  /** What the process wrote to stdout and stderr so far. */
  output(): string;
  /** SIGTERM, then SIGKILL after 5 s; resolves when it has exited. */
  stop(): Promise<void>;
}

/** The status of GET /api/health, or 0 while nothing answers. */
export async function healthStatus(url: string): Promise<number> {
  try {
    return (await fetch(`${url}/api/health`)).status;
  } catch {
    return 0;
  }
}

/** Polls until `check` holds, failing after `timeoutMs` with `what` in the message. */
export async function waitFor(what: string, check: () => Promise<boolean>, timeoutMs = 30_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (await check()) return;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error(`timed out waiting for ${what}`);
}

/** Starts server/index.ts against `databaseUrl` and waits until its health check answers 200. */
export async function startApiProcess(databaseUrl: string): Promise<ApiProcess> {
  const port = await freePort();
  const url = `http://127.0.0.1:${port}`;
  // node itself with tsx as a loader, not the tsx command: that one runs the server in a child process of its
  // own, and a SIGKILL sent to it would leave the server running.
  const child = spawn(process.execPath, ['--import', 'tsx', path.join(root, 'server', 'index.ts')], {
    cwd: root,
    env: { ...process.env, PORT: String(port), PUBLIC_URL: url, DATABASE_URL: databaseUrl },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout?.on('data', (chunk: Buffer) => (output += chunk.toString()));
  child.stderr?.on('data', (chunk: Buffer) => (output += chunk.toString()));
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  try {
    await waitFor(`the API process on ${url}`, async () => {
      if (child.exitCode !== null) throw new Error(`the API process exited early:\n${output}`);
      return (await healthStatus(url)) === 200;
    });
  } catch (error) {
    child.kill('SIGKILL');
    throw error;
  }
  return {
    url,
    child,
    output: () => output,
    stop: async () => {
      if (child.exitCode === null && child.signalCode === null) {
        child.kill('SIGTERM');
        const killer = setTimeout(() => child.kill('SIGKILL'), 5000);
        await exited;
        clearTimeout(killer);
      }
    },
  };
}

/** Gives a person a read-write access token straight in the database; returns the secret for a Bearer header. */
export async function grantToken(databaseUrl: string, email: string): Promise<string> {
  const secret = `tsk_${crypto.randomBytes(24).toString('base64url')}`;
  const hash = crypto.createHash('sha256').update(secret).digest('hex');
  const [person] = await queryDatabase<{ id: string }>(databaseUrl, 'SELECT id FROM users WHERE email = $1', [email]);
  if (!person) throw new Error(`no person with the address ${email}`);
  await queryDatabase(
    databaseUrl,
    `INSERT INTO access_tokens (id, user_id, name, scope, prefix, token_hash, created_at, updated_at)
     VALUES (gen_random_uuid(), $1, 'fault test', 'read_write', $2, $3, now(), now())`,
    [person.id, secret.slice(0, 10), hash],
  );
  return secret;
}
