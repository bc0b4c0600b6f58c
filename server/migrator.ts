import type { QueryInterface, Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug, type MigrationFn } from 'umzug';
import * as foundation from './migrations/0001-foundation';
import * as revisions from './migrations/0002-revisions';
import * as baselinesStudiesAudit from './migrations/0003-baselines-studies-audit';
import * as notifications from './migrations/0004-notifications';

export type Migration = MigrationFn<QueryInterface>;

/** Migrations in order; add a new file under migrations/ and list it here. */
const migrations = [
  { name: '0001-foundation', ...foundation },
  { name: '0002-revisions', ...revisions },
  { name: '0003-baselines-studies-audit', ...baselinesStudiesAudit },
  { name: '0004-notifications', ...notifications },
];

/** An umzug migrator over the given connection, recording applied migrations in the SequelizeMeta table. */
export function createMigrator(sequelize: Sequelize) {
  return new Umzug({
    migrations,
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize }),
    logger: undefined,
  });
}
