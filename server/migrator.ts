import type { QueryInterface, Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug, type MigrationFn } from 'umzug';
import * as foundation from './migrations/0001-foundation';
import * as revisions from './migrations/0002-revisions';
import * as baselinesStudiesAudit from './migrations/0003-baselines-studies-audit';
import * as notifications from './migrations/0004-notifications';
import * as imports from './migrations/0005-imports';
import * as attachments from './migrations/0006-attachments';
import * as allowanceTables from './migrations/0007-allowance-tables';
import * as identityInvitations from './migrations/0008-identity-invitations';
import * as rateLimitsSessions from './migrations/0009-rate-limits-sessions';

export type Migration = MigrationFn<QueryInterface>;

/** Migrations in order; add a new file under migrations/ and list it here. */
const migrations = [
  { name: '0001-foundation', ...foundation },
  { name: '0002-revisions', ...revisions },
  { name: '0003-baselines-studies-audit', ...baselinesStudiesAudit },
  { name: '0004-notifications', ...notifications },
  { name: '0005-imports', ...imports },
  { name: '0006-attachments', ...attachments },
  { name: '0007-allowance-tables', ...allowanceTables },
  { name: '0008-identity-invitations', ...identityInvitations },
  { name: '0009-rate-limits-sessions', ...rateLimitsSessions },
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
