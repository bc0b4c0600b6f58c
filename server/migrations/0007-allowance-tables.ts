import type { Migration } from '../migrator';

/**
 * A team's own allowance table per craft: the budget roll-up of the craft's sheets reads it in place of the
 * shipped preset the sheet names. One per craft; the table itself is JSON checked by the shared schema.
 */
export const up: Migration = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query(`
    CREATE TABLE allowance_tables (
      id uuid PRIMARY KEY,
      craft_id uuid NOT NULL UNIQUE REFERENCES crafts (id) ON DELETE CASCADE,
      preset jsonb NOT NULL CHECK (jsonb_typeof(preset) = 'object'),
      updated_by_id uuid REFERENCES users (id) ON DELETE SET NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
  `);
};

export const down: Migration = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query('DROP TABLE allowance_tables;');
};
