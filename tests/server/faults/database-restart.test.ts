import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { ensureDatabase, startPostgres, type RunningPostgres } from '@/server/dev/postgres';
import { prepareDatabase } from '@/server/dev/prepare-database';
import { freePort, grantToken, startApiProcess, waitFor, type ApiProcess } from '../helpers/api-process';

jest.setTimeout(180_000);

/**
 * A cluster of this test's own: stopping the one `npm test` started would fail every other test running
 * beside this one.
 */
let dataDir: string;
let pgPort: number;
let postgres: RunningPostgres;
let api: ApiProcess;
let token: string;

const startCluster = () => startPostgres({ dataDir, port: pgPort, settings: { fsync: 'off' } });

beforeAll(async () => {
  dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'trimsheet-restart-'));
  pgPort = await freePort();
  postgres = startCluster();
  await ensureDatabase(postgres.url('postgres'), 'trimsheet');
  await prepareDatabase(postgres.url('trimsheet'));
  api = await startApiProcess(postgres.url('trimsheet'));
  token = await grantToken(postgres.url('trimsheet'), 'amara.osei@corvid-sailworks.example');
});

afterAll(async () => {
  await api?.stop();
  postgres?.stop();
  fs.rmSync(dataDir, { recursive: true, force: true });
});

async function listCrafts() {
  const response = await fetch(`${api.url}/api/crafts`, { headers: { Authorization: `Bearer ${token}` } });
  return { status: response.status, body: (await response.json()) as { error?: { code: string } } };
}

describe('PostgreSQL restarted under a running API process', () => {
  it('answers 503 database_unavailable while the database is down, then recovers by itself', async () => {
    expect((await listCrafts()).status).toBe(200);

    postgres.stop();
    const whileDown = await listCrafts();
    expect(whileDown).toEqual({ status: 503, body: { error: expect.objectContaining({ code: 'database_unavailable' }) } });
    const health = await fetch(`${api.url}/api/health`);
    expect(health.status).toBe(503);

    postgres = startCluster();
    await waitFor('the craft list to answer again', async () => (await listCrafts()).status === 200);
    // The same process served throughout: no restart of the API.
    expect(api.child.exitCode).toBeNull();
    expect(api.output()).not.toMatch(/Unhandled error/);
  });
});
