import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { inheritedEnvironment, loadStackConfig } from '../env';
import { startMailFake, type MailFake } from './mail-fake';
import { startOidcFake } from './oidc-fake';
import { ensureDatabase, startPostgres, type RunningPostgres } from './postgres';
import { prepareDatabase } from './prepare-database';

/**
 * The local stack behind `npm start` and `npm test`: PostgreSQL on loopback, migrations and demo
 * seed, the web build, the sign-in and mail fakes, and the Trimsheet server. Everything it starts
 * it stops again on exit, Ctrl-C or SIGTERM.
 */
type Environment = NodeJS.ProcessEnv;

const root = path.resolve(__dirname, '..', '..');
const bin = (name: string) => path.join(root, 'node_modules', '.bin', name);
const log = (message: string) => console.log(`[trimsheet] ${message}`);

const cleanups: (() => Promise<void> | void)[] = [];
let stopping = false;
async function stopAll(code: number): Promise<never> {
  if (!stopping) {
    stopping = true;
    for (const cleanup of cleanups.reverse()) {
      try {
        await cleanup();
      } catch (error) {
        console.error('[trimsheet] while stopping:', error);
      }
    }
  }
  process.exit(code);
}
for (const signal of ['SIGINT', 'SIGTERM'] as const) process.on(signal, () => void stopAll(0));

function buildWebApp(skip: boolean) {
  if (skip) return log('skipping the web build (TRIMSHEET_SKIP_BUILD=1)');
  log('building the web app (expo export)...');
  const result = spawnSync(bin('expo'), ['export', '--platform', 'web', '--output-dir', 'dist'], {
    cwd: root,
    stdio: 'inherit',
    env: { ...inheritedEnvironment(), EXPO_OFFLINE: '1', CI: '1' },
  });
  if (result.status !== 0) throw new Error('the web build failed');
  // Metro bundles no Web Worker: the uncertainty study's worker is bundled on its own, beside the app's files.
  const worker = spawnSync(
    bin('esbuild'),
    ['components/sizing/uncertainty/uncertainty-worker.ts', '--bundle', '--minify', '--target=es2020', '--outfile=dist/uncertainty-worker.js'],
    { cwd: root, stdio: 'inherit', env: inheritedEnvironment() },
  );
  if (worker.status !== 0) throw new Error('the uncertainty worker build failed');
}

function startServer(env: Environment): Promise<ChildProcess> {
  const server = spawn(bin('tsx'), [path.join(root, 'server', 'index.ts')], { cwd: root, env, stdio: ['ignore', 'inherit', 'inherit'] });
  cleanups.push(
    () =>
      new Promise<void>((resolve) => {
        if (server.exitCode !== null) return resolve();
        server.once('exit', () => resolve());
        server.kill('SIGTERM');
      }),
  );
  return waitForHealth(`http://127.0.0.1:${env.PORT}/api/health`, server).then(() => server);
}

async function waitForHealth(url: string, server: ChildProcess) {
  for (let attempt = 0; attempt < 120; attempt += 1) {
    if (server.exitCode !== null) throw new Error('the server exited during start-up');
    try {
      if ((await fetch(url)).ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  throw new Error(`the server did not answer ${url}`);
}

interface Services {
  pg: RunningPostgres;
  mail: MailFake;
  issuer: string;
}

async function startServices(options: { dataDir: string; pgPort: number; oidcPort: number; smtpPort: number; inboxPort: number; appUrl: string; testCluster: boolean }): Promise<Services> {
  log(`starting PostgreSQL on 127.0.0.1:${options.pgPort} (data in ${options.dataDir})`);
  const pg = startPostgres({
    dataDir: options.dataDir,
    port: options.pgPort,
    settings: options.testCluster ? { fsync: 'off', synchronous_commit: 'off', full_page_writes: 'off' } : {},
  });
  cleanups.push(() => {
    log('stopping PostgreSQL');
    pg.stop();
  });
  const oidc = await startOidcFake({ port: options.oidcPort, publicUrl: options.appUrl });
  cleanups.push(() => oidc.close());
  const mail = await startMailFake({ smtpPort: options.smtpPort, httpPort: options.inboxPort });
  cleanups.push(() => mail.close());
  log(`sign-in fake at ${oidc.issuer}, mail fake at smtp://127.0.0.1:${options.smtpPort} (inbox ${mail.inboxUrl})`);
  return { pg, mail, issuer: oidc.issuer };
}

function appEnvironment(services: Services, port: number, databaseUrl: string, extra: Partial<Environment>): Environment {
  return {
    ...inheritedEnvironment(),
    PORT: String(port),
    HOST: '127.0.0.1',
    PUBLIC_URL: `http://127.0.0.1:${port}`,
    DATABASE_URL: databaseUrl,
    OIDC_ISSUER: services.issuer,
    GOOGLE_AUTHORIZATION_URL: `${services.issuer}/auth`,
    GOOGLE_TOKEN_URL: `${services.issuer}/token`,
    GOOGLE_USERINFO_URL: `${services.issuer}/me/userinfo`,
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(services.mail.smtpPort),
    ...extra,
  };
}

async function start() {
  const stack = loadStackConfig();
  const appUrl = `http://127.0.0.1:${stack.PORT}`;
  buildWebApp(stack.TRIMSHEET_SKIP_BUILD === '1');
  const services = await startServices({
    dataDir: path.join(stack.TRIMSHEET_DATA_DIR, 'postgres'),
    pgPort: stack.TRIMSHEET_PG_PORT,
    oidcPort: stack.TRIMSHEET_OIDC_PORT,
    smtpPort: stack.TRIMSHEET_SMTP_PORT,
    inboxPort: stack.TRIMSHEET_INBOX_PORT,
    appUrl,
    testCluster: false,
  });
  await ensureDatabase(services.pg.url('postgres'), 'trimsheet');
  log('migrating and seeding the demo');
  await prepareDatabase(services.pg.url('trimsheet'));
  await startServer(appEnvironment(services, stack.PORT, services.pg.url('trimsheet'), { NODE_ENV: 'development' }));
  log(`Trimsheet is running at ${appUrl} — press Ctrl-C to stop`);
}

async function test(jestArgs: string[]) {
  const stack = loadStackConfig();
  buildWebApp(stack.TRIMSHEET_SKIP_BUILD === '1');
  const scratch = fs.mkdtempSync(path.join(os.tmpdir(), 'trimsheet-test-'));
  cleanups.push(() => fs.rmSync(scratch, { recursive: true, force: true }));
  const appUrl = `http://127.0.0.1:${stack.TRIMSHEET_TEST_PORT}`;
  const services = await startServices({
    dataDir: path.join(scratch, 'postgres'),
    pgPort: stack.TRIMSHEET_TEST_PG_PORT,
    oidcPort: stack.TRIMSHEET_TEST_OIDC_PORT,
    smtpPort: stack.TRIMSHEET_TEST_SMTP_PORT,
    inboxPort: stack.TRIMSHEET_TEST_INBOX_PORT,
    appUrl,
    testCluster: true,
  });
  const admin = services.pg.url('postgres');
  await ensureDatabase(admin, 'trimsheet_template');
  await prepareDatabase(services.pg.url('trimsheet_template'));
  await ensureDatabase(admin, 'trimsheet_e2e', 'trimsheet_template');
  const testEnv = appEnvironment(services, stack.TRIMSHEET_TEST_PORT, services.pg.url('trimsheet_e2e'), {
    NODE_ENV: 'test',
    SIGN_IN_RATE_LIMIT: '10000',
    WRITE_RATE_LIMIT: '100000',
    TEST_ADMIN_DATABASE_URL: admin,
    TEST_TEMPLATE_DATABASE: 'trimsheet_template',
    TEST_APP_URL: appUrl,
    TEST_MAIL_INBOX_URL: services.mail.inboxUrl,
    TEST_SKIP_BROWSER: stack.TRIMSHEET_SKIP_BUILD,
  });
  await startServer(testEnv);
  log('running the tests');
  // Asynchronous on purpose: the fakes in this process must keep answering while jest runs.
  const jest = spawn(bin('jest'), ['--maxWorkers=2', ...jestArgs], { cwd: root, stdio: 'inherit', env: testEnv });
  const code = await new Promise<number>((resolve) => jest.once('exit', (status) => resolve(status ?? 1)));
  await stopAll(code);
}

const [mode, ...args] = process.argv.slice(2);
(mode === 'test' ? test(args) : start()).catch(async (error: unknown) => {
  console.error('[trimsheet]', error instanceof Error ? error.message : error);
  await stopAll(1);
});
