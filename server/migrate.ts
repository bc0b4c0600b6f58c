import { createDatabase } from './db';
import { loadConfig } from './env';
import { createMigrator } from './migrator';

/** `npm run migrate`: applies pending migrations to DATABASE_URL, once per release, before new servers start. */
async function main() {
  const sequelize = createDatabase(loadConfig());
  try {
    const applied = await createMigrator(sequelize).up();
    console.log(applied.length ? `applied ${applied.map((m) => m.name).join(', ')}` : 'the database is up to date');
  } finally {
    await sequelize.close();
  }
}

main().catch((error: unknown) => {
  console.error('[trimsheet] migration failed:', error);
  process.exit(1);
});
