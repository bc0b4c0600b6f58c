import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { startMailFake } from '@/server/dev/mail-fake';
import { startOidcFake } from '@/server/dev/oidc-fake';
import { ensureDatabase, startPostgres } from '@/server/dev/postgres';
import { prepareDatabase } from '@/server/dev/prepare-database';
import { inheritedEnvironment } from '@/server/env';

/**
 * The product stack the benchmarks measure, started and stopped by `npm run bench` itself: a throw-away
 * PostgreSQL cluster, migrated and seeded with the demo, the sign-in and mail fakes, and the Trimsheet
 * server in a child process of its own (so the load generator in this process does not share its event loop).
 * Its ports differ from those of `npm start` and `npm test`, so a benchmark can run beside either;
 * TRIMSHEET_BENCH_PORT_OFFSET shifts them all, so that two benchmark runs can share a machine.
 */
const portOffset = Number(process.env.TRIMSHEET_BENCH_PORT_OFFSET ?? 0);
export const benchPorts = {
  app: 8481 + portOffset,
  postgres: 5734 + portOffset,
  oidc: 8490 + portOffset,
  smtp: 2925 + portOffset,
  inbox: 8495 + portOffset,
} as const;

const root = path.resolve(__dirname, '..', '..');
const tsx = path.join(root, 'node_modules', '.bin', 'tsx');

export interface BenchStack {
  appUrl: string;
  /** The seeded database the server uses, for fixtures written through the service layer. */
  databaseUrl: string;
  /** The server's process (tsx, with the node process it runs as a child): its memory is read from /proc. */
  serverPid: number | undefined;
  stop(): Promise<void>;
}

/** Runs a TypeScript entry point with tsx in a child process; `stop` sends SIGTERM and waits for it to exit. */
export function spawnTypeScript(entry: string, args: string[], env: NodeJS.ProcessEnv): { child: ChildProcess; stop(): Promise<void> } {
  const child = spawn(tsx, [entry, ...args], { cwd: root, env, stdio: ['ignore', 'ignore', 'inherit'] });
  return {
    child,
    stop: () =>
      new Promise<void>((resolve) => {
        if (child.exitCode !== null || child.signalCode !== null) return resolve();
        child.once('exit', () => resolve());
        child.kill('SIGTERM');
      }),
  };
}

/** Polls a URL until it answers 2xx; fails early when the process behind it has exited. */
export async function waitUntilAnswering(url: string, child: ChildProcess, seconds = 60): Promise<void> {
  const deadline = Date.now() + seconds * 1000;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`the process behind ${url} exited with ${child.exitCode} during start-up`);
    try {
      if ((await fetch(url)).ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  throw new Error(`${url} did not answer within ${seconds} s`);
}

/** Starts the whole stack on the benchmark ports; everything started is stopped again by `stop()`, also on failure. */
export async function startBenchStack(): Promise<BenchStack> {
  const stops: (() => Promise<void> | void)[] = [];
  const stop = async () => {
    for (const step of stops.reverse()) await step();
  };
  try {
    const scratch = fs.mkdtempSync(path.join(os.tmpdir(), 'trimsheet-bench-'));
    stops.push(() => fs.rmSync(scratch, { recursive: true, force: true }));
    const pg = startPostgres({
      dataDir: path.join(scratch, 'postgres'),
      port: benchPorts.postgres,
      settings: { fsync: 'off', synchronous_commit: 'off', full_page_writes: 'off' },
    });
    stops.push(() => pg.stop());
    await ensureDatabase(pg.url('postgres'), 'trimsheet');
    await prepareDatabase(pg.url('trimsheet'));

    const appUrl = `http://127.0.0.1:${benchPorts.app}`;
    const oidc = await startOidcFake({ port: benchPorts.oidc, publicUrl: appUrl });
    stops.push(() => oidc.close());
    const mail = await startMailFake({ smtpPort: benchPorts.smtp, httpPort: benchPorts.inbox });
    stops.push(() => mail.close());

    const server = spawnTypeScript(path.join(root, 'server', 'index.ts'), [], {
      ...inheritedEnvironment(),
      NODE_ENV: 'test',
      PORT: String(benchPorts.app),
      HOST: '127.0.0.1',
      PUBLIC_URL: appUrl,
      DATABASE_URL: pg.url('trimsheet'),
      OIDC_ISSUER: oidc.issuer,
      GOOGLE_AUTHORIZATION_URL: `${oidc.issuer}/auth`,
      GOOGLE_TOKEN_URL: `${oidc.issuer}/token`,
      GOOGLE_USERINFO_URL: `${oidc.issuer}/me/userinfo`,
      SMTP_HOST: '127.0.0.1',
      SMTP_PORT: String(mail.smtpPort),
      SIGN_IN_RATE_LIMIT: '10000',
      WRITE_RATE_LIMIT: '100000',
    });
    stops.push(server.stop);
    await waitUntilAnswering(`${appUrl}/api/health`, server.child);
    return { appUrl, databaseUrl: pg.url('trimsheet'), serverPid: server.child.pid, stop };
  } catch (error) {
    await stop();
    throw error;
  }
}
