import { createDatabase } from '../db';
import { createMigrator } from '../migrator';
import { seedDemo } from '../seed/seed-demo';

/** Applies pending migrations and seeds the demo, then closes the connection (a template must have none open). */
export async function prepareDatabase(databaseUrl: string): Promise<void> {
  const sequelize = createDatabase({ databaseUrl, databasePoolMax: 2 });
  try {
    await createMigrator(sequelize).up();
    await seedDemo(sequelize);
  } finally {
    await sequelize.close();
  }
}
