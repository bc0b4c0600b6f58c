import crypto from 'node:crypto';
import { grantToken, queryDatabase, startApiProcess, type ApiProcess } from '../helpers/api-process';
import { testStack } from '../helpers/test-app';

jest.setTimeout(120_000);

/** Rows of Tern's draft that Amara may edit, each written by its own stream of sequential PATCHes. */
const streamedKeys = ['sail_side', 'film_thickness', 'deployer_mass', 'boom_linear_density'];

let databaseUrl: string;
let adminUrl: string;
let databaseName: string;

beforeAll(async () => {
  adminUrl = testStack.TEST_ADMIN_DATABASE_URL;
  databaseName = `t_kill_${crypto.randomBytes(4).toString('hex')}`;
  await queryDatabase(adminUrl, `CREATE DATABASE "${databaseName}" TEMPLATE "${testStack.TEST_TEMPLATE_DATABASE}"`);
  const url = new URL(adminUrl);
  url.pathname = `/${databaseName}`;
  databaseUrl = url.toString();
});

afterAll(async () => {
  await queryDatabase(adminUrl, `DROP DATABASE IF EXISTS "${databaseName}" WITH (FORCE)`);
});

interface RowState {
  id: string;
  value: number | null;
  version: number;
}

async function rowState(key: string): Promise<RowState> {
  const [row] = await queryDatabase<RowState>(
    databaseUrl,
    `SELECT p.id, p.value, p.version FROM revision_parameters p
       JOIN revisions r ON r.id = p.revision_id JOIN crafts c ON c.id = r.craft_id
      WHERE c.name = 'Tern' AND r.kind = 'draft' AND p.key = $1`,
    [key],
  );
  if (!row) throw new Error(`Tern's draft has no row ${key}`);
  return row;
}

/** Values the row's history recorded for updates after `since`, oldest first. */
async function recordedValues(key: string, since: Date): Promise<number[]> {
  const rows = await queryDatabase<{ value: string | null }>(
    databaseUrl,
    `SELECT ch.after->>'value' AS value FROM parameter_changes ch
       JOIN revisions r ON r.id = ch.revision_id JOIN crafts c ON c.id = r.craft_id
      WHERE c.name = 'Tern' AND r.kind = 'draft' AND ch.key = $1 AND ch.action = 'update' AND ch.changed_at >= $2
      ORDER BY ch.changed_at, ch.id`,
    [key, since],
  );
  return rows.map((row) => Number(row.value));
}

/**
 * Writes 1, 2, 3... to the row one PATCH at a time until the server goes away; returns the values the
 * server acknowledged.
 */
async function streamWrites(api: ApiProcess, token: string, craftPath: string, key: string, startVersion: number) {
  const acknowledged: number[] = [];
  let version = startVersion;
  for (let value = 1; ; value += 1) {
    let response: Response;
    try {
      response = await fetch(`${api.url}${craftPath}/parameters/${key}`, {
        method: 'PATCH',
        headers: { Authorization: `Bearer ${token}`, 'Content-Type': 'application/json' },
        body: JSON.stringify({ version, value }),
      });
    } catch {
      return acknowledged;
    }
    if (response.status !== 200) throw new Error(`PATCH ${key} = ${value} answered ${response.status}: ${await response.text()}`);
    version = ((await response.json()) as { version: number }).version;
    acknowledged.push(value);
  }
}

describe('an API process killed in the middle of writes', () => {
  it('leaves every write whole: the row, its version and its history agree, and nothing acknowledged is lost', async () => {
    const api = await startApiProcess(databaseUrl);
    const token = await grantToken(databaseUrl, 'amara.osei@corvid-sailworks.example');
    const [tern = { id: '', draft: '' }] = await queryDatabase<{ id: string; draft: string }>(
      databaseUrl,
      `SELECT c.id, r.id AS draft FROM crafts c JOIN revisions r ON r.craft_id = c.id AND r.kind = 'draft' WHERE c.name = 'Tern'`,
    );
    const craftPath = `/api/crafts/${tern.id}/revisions/${tern.draft}`;
    const before = await Promise.all(streamedKeys.map(rowState));
    const since = new Date(Date.now() - 1000);

    const streams = streamedKeys.map((key, index) => streamWrites(api, token, craftPath, key, before[index]?.version ?? 1));
    // Let every stream get going, then kill the process without warning while writes are in flight.
    await new Promise((resolve) => setTimeout(resolve, 1500));
    api.child.kill('SIGKILL');
    const acknowledged = await Promise.all(streams);

    for (const [index, key] of streamedKeys.entries()) {
      const [after, initial, sent] = [await rowState(key), before[index], acknowledged[index]];
      if (!initial || !sent) throw new Error(`no stream for ${key}`);
      const history = await recordedValues(key, since);
      const written = after.version - initial.version;
      // Each committed write bumped the version once and recorded exactly one history entry, in order.
      expect(history).toEqual(Array.from({ length: written }, (_, i) => i + 1));
      // The row holds the last committed value (or its old one when nothing committed).
      expect(after.value).toBe(written === 0 ? initial.value : written);
      // What the server acknowledged was committed; at most the one write in flight committed unacknowledged.
      expect(written).toBeGreaterThanOrEqual(sent.length);
      expect(written).toBeLessThanOrEqual(sent.length + 1);
    }
    expect(acknowledged.some((values) => values.length > 0)).toBe(true);
  });
});
