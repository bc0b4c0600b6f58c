import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
};
const uuidKey = { type: DataTypes.UUID, primaryKey: true, allowNull: false };
const reference = (table: string, onDelete: 'CASCADE' | 'SET NULL' | 'RESTRICT', allowNull = false) => ({
  type: DataTypes.UUID,
  allowNull,
  references: { model: table, key: 'id' },
  onDelete,
});

/** Organisations, people, their sign-in identities, crafts, memberships, invitations and the session store. */
export const up: Migration = async ({ context: queryInterface }) => {
  await queryInterface.createTable('organisations', {
    id: uuidKey,
    name: { type: DataTypes.TEXT, allowNull: false },
    slug: { type: DataTypes.TEXT, allowNull: false, unique: true },
    ...timestamps,
  });
  await queryInterface.createTable('users', {
    id: uuidKey,
    organisation_id: reference('organisations', 'RESTRICT'),
    email: { type: DataTypes.TEXT, allowNull: false, unique: true },
    name: { type: DataTypes.TEXT, allowNull: false },
    is_org_admin: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    ...timestamps,
  });
  await queryInterface.createTable('identities', {
    id: uuidKey,
    user_id: reference('users', 'CASCADE'),
    provider: { type: DataTypes.TEXT, allowNull: false },
    subject: { type: DataTypes.TEXT, allowNull: false },
    ...timestamps,
  });
  await queryInterface.addIndex('identities', ['provider', 'subject'], { unique: true });
  await queryInterface.createTable('crafts', {
    id: uuidKey,
    organisation_id: reference('organisations', 'RESTRICT'),
    created_by_id: reference('users', 'SET NULL', true),
    name: { type: DataTypes.TEXT, allowNull: false },
    description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    ...timestamps,
  });
  await queryInterface.addIndex('crafts', ['organisation_id']);
  await queryInterface.createTable('memberships', {
    id: uuidKey,
    craft_id: reference('crafts', 'CASCADE'),
    user_id: reference('users', 'CASCADE'),
    role: { type: DataTypes.TEXT, allowNull: false },
    subsystems: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false, defaultValue: [] },
    ...timestamps,
  });
  await queryInterface.addIndex('memberships', ['craft_id', 'user_id'], { unique: true });
  await queryInterface.sequelize.query(
    `ALTER TABLE memberships ADD CONSTRAINT memberships_role_check
       CHECK (role IN ('viewer', 'partner', 'subsystem_owner', 'systems_engineer', 'chief_engineer'))`,
  );
  await queryInterface.createTable('invitations', {
    id: uuidKey,
    organisation_id: reference('organisations', 'CASCADE'),
    invited_by_id: reference('users', 'CASCADE'),
    email: { type: DataTypes.TEXT, allowNull: false },
    name: { type: DataTypes.TEXT, allowNull: false },
    accepted_at: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await queryInterface.addIndex('invitations', ['email']);
  // The table connect-pg-simple expects; the index on the signed-in user serves "sign out everywhere".
  await queryInterface.sequelize.query(`
    CREATE TABLE sessions (
      sid varchar NOT NULL PRIMARY KEY,
      sess json NOT NULL,
      expire timestamp(6) NOT NULL
    );
    CREATE INDEX sessions_expire_idx ON sessions (expire);
    CREATE INDEX sessions_user_idx ON sessions ((sess -> 'passport' ->> 'user'));
  `);
};

export const down: Migration = async ({ context: queryInterface }) => {
  for (const table of ['sessions', 'invitations', 'memberships', 'crafts', 'identities', 'users', 'organisations']) {
    await queryInterface.dropTable(table);
  }
};
