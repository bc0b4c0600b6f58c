import type { Migration } from '../migrator';

/**
 * Invitations name the provider they link (null: either, for a new person), can be withdrawn, and have
 * capped lengths (an address of at most 254 characters, RFC 5321 §4.5.3.1.3 with the angle brackets taken
 * off; a name of at most 120). The caps are NOT VALID so that rows written before them stay readable; every
 * new or changed row is checked. Pending invitations are found by address at every first sign-in.
 */
export const up: Migration = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query(`
    ALTER TABLE invitations
      ADD COLUMN provider text CHECK (provider IN ('google', 'sso')),
      ADD COLUMN withdrawn_at timestamptz,
      ADD COLUMN withdrawn_by_id uuid REFERENCES users (id) ON DELETE SET NULL,
      ADD CONSTRAINT invitations_email_length CHECK (char_length(email) <= 254) NOT VALID,
      ADD CONSTRAINT invitations_name_length CHECK (char_length(name) <= 120) NOT VALID;
    ALTER TABLE users ADD CONSTRAINT users_email_length CHECK (char_length(email) <= 254) NOT VALID;
    CREATE INDEX invitations_pending_email_idx ON invitations (lower(email)) WHERE accepted_at IS NULL AND withdrawn_at IS NULL;
  `);
};

export const down: Migration = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query(`
    DROP INDEX invitations_pending_email_idx;
    ALTER TABLE users DROP CONSTRAINT users_email_length;
    ALTER TABLE invitations
      DROP CONSTRAINT invitations_name_length,
      DROP CONSTRAINT invitations_email_length,
      DROP COLUMN withdrawn_by_id,
      DROP COLUMN withdrawn_at,
      DROP COLUMN provider;
  `);
};
