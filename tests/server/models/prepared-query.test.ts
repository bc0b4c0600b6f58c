import { preparedQuery } from '@/server/models/prepared-query';
import { createTestApp, type TestApp } from '../helpers/test-app';

jest.setTimeout(30_000);

let testApp: TestApp;

beforeAll(async () => {
  testApp = await createTestApp();
});

afterAll(async () => {
  await testApp.close();
});

describe('preparedQuery', () => {
  it('reads with binds, the same statement again and again', async () => {
    const text = 'SELECT $1::int + 1 AS next';
    for (const value of [1, 2, 3]) {
      expect(await preparedQuery<{ next: number }>(testApp.sequelize, text, [value])).toEqual([{ next: value + 1 }]);
    }
  });

  it('recovers when a migration changes a column type under a prepared statement', async () => {
    await testApp.sequelize.query('CREATE TABLE widths (width integer)');
    await testApp.sequelize.query('INSERT INTO widths VALUES (40)');
    const text = 'SELECT width FROM widths';
    expect(await preparedQuery(testApp.sequelize, text, [])).toEqual([{ width: 40 }]);

    await testApp.sequelize.query('ALTER TABLE widths ALTER COLUMN width TYPE text');
    const outcomes: unknown[] = [];
    for (let call = 0; call < 12; call += 1) {
      outcomes.push(
        await preparedQuery(testApp.sequelize, text, []).then(
          (rows) => rows,
          (error: { code?: string }) => error.code,
        ),
      );
    }
    // The connection that held the old plan fails once and is replaced; every call after that reads the new type.
    expect(outcomes.filter((outcome) => outcome === '0A000').length).toBeLessThanOrEqual(1);
    expect(outcomes.slice(-3)).toEqual([[{ width: '40' }], [{ width: '40' }], [{ width: '40' }]]);
  });
});
