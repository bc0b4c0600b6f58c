import { execFileSync } from 'node:child_process';
import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { queryDatabase } from '../helpers/api-process';
import { testStack } from '../helpers/test-app';

jest.setTimeout(120_000);

const PG_BIN = '/usr/lib/postgresql/15/bin';
const suffix = crypto.randomBytes(4).toString('hex');
const original = `t_backup_${suffix}`;
const restored = `t_restored_${suffix}`;
const admin = new URL(testStack.TEST_ADMIN_DATABASE_URL);
const connection = ['-h', admin.hostname, '-p', admin.port, '-U', decodeURIComponent(admin.username)];
const urlOf = (database: string) => Object.assign(new URL(admin), { pathname: `/${database}` }).toString();
let scratch: string;

beforeAll(async () => {
  scratch = fs.mkdtempSync(path.join(os.tmpdir(), 'trimsheet-backup-'));
  await queryDatabase(admin.toString(), `CREATE DATABASE "${original}" TEMPLATE "${testStack.TEST_TEMPLATE_DATABASE}"`);
});

afterAll(async () => {
  for (const database of [original, restored]) {
    await queryDatabase(admin.toString(), `DROP DATABASE IF EXISTS "${database}" WITH (FORCE)`);
  }
  fs.rmSync(scratch, { recursive: true, force: true });
});

/** Every craft, sheet row, revision and person, each table as one fingerprint of its full contents. */
async function fingerprint(database: string) {
  const tables = ['crafts', 'revision_parameters', 'revisions', 'users', 'subsystems', 'memberships', 'parameter_changes'];
  const result: Record<string, { count: number; digest: string }> = {};
  for (const table of tables) {
    const [row = { count: '0', digest: '' }] = await queryDatabase<{ count: string; digest: string }>(
      urlOf(database),
      `SELECT count(*) AS count, md5(coalesce(string_agg(t::text, '|' ORDER BY t.id), '')) AS digest FROM ${table} t`,
    );
    result[table] = { count: Number(row.count), digest: row.digest };
  }
  return result;
}

describe('backup and restore as the README documents them', () => {
  it('restores every craft, row, revision and person into a fresh database', async () => {
    const dump = path.join(scratch, 'trimsheet.dump');
    // README "Data, backup and restore": pg_dump -Fc, createdb, pg_restore --no-owner --exit-on-error.
    execFileSync(path.join(PG_BIN, 'pg_dump'), [...connection, '-Fc', '-f', dump, original]);
    execFileSync(path.join(PG_BIN, 'createdb'), [...connection, restored]);
    execFileSync(path.join(PG_BIN, 'pg_restore'), [...connection, '-d', restored, '--no-owner', '--exit-on-error', dump]);

    const before = await fingerprint(original);
    expect(before.crafts?.count).toBeGreaterThan(0);
    expect(before.revision_parameters?.count).toBeGreaterThan(0);
    expect(await fingerprint(restored)).toEqual(before);
  });

  it('keeps the lock rules of baselines in the restored copy', async () => {
    const [locked = { id: '' }] = await queryDatabase<{ id: string }>(
      urlOf(restored),
      `SELECT p.id FROM revision_parameters p JOIN revisions r ON r.id = p.revision_id WHERE r.state = 'locked' LIMIT 1`,
    );
    expect(locked.id).not.toBe('');
    await expect(
      queryDatabase(urlOf(restored), 'UPDATE revision_parameters SET note = $1 WHERE id = $2', ['changed', locked.id]),
    ).rejects.toThrow(/locked/);
  });
});
