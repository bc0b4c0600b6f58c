import { QueryTypes } from 'sequelize';
import { createMigrator } from '@/server/migrator';
import { createTestApp, type TestApp } from './helpers/test-app';

let testApp: TestApp;

beforeAll(async () => {
  testApp = await createTestApp();
});

afterAll(async () => {
  await testApp.close();
});

describe('migration 0002-revisions', () => {
  it('turns the subsystem names memberships held into subsystem records of their craft, and back', async () => {
    const { sequelize } = testApp;
    const migrator = createMigrator(sequelize);
    await migrator.down({ to: '0002-revisions' });
    await sequelize.query(`UPDATE memberships SET subsystems = ARRAY['Booms', 'Deployer'] WHERE role = 'subsystem_owner'`);
    await migrator.up();

    const owned = await sequelize.query<{ craft: string; names: string[] }>(
      `SELECT c.name AS craft, ARRAY(SELECT s.name FROM subsystems s WHERE s.id = ANY (m.subsystem_ids) ORDER BY s.name) AS names
       FROM memberships m JOIN crafts c ON c.id = m.craft_id WHERE m.role = 'subsystem_owner'`,
      { type: QueryTypes.SELECT },
    );
    expect(owned).toEqual([{ craft: 'Tern', names: ['Booms', 'Deployer'] }]);
    const columns = await sequelize.query<{ column_name: string }>(
      `SELECT column_name FROM information_schema.columns WHERE table_name = 'memberships' AND column_name LIKE 'subsystem%'`,
      { type: QueryTypes.SELECT },
    );
    expect(columns.map((column) => column.column_name)).toEqual(['subsystem_ids']);
  });
});
