import type { Migration } from '../migrator';

/**
 * Workbook imports: the preview of a workbook read against a revision (what it would change, its problems and the
 * rows left out), and the steps accepting it applies. A preview is the importer's own, expires, and is accepted
 * at most once (then it names the study it opened).
 */
export const up: Migration = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query(`
    CREATE TABLE imports (
      id uuid PRIMARY KEY,
      craft_id uuid NOT NULL REFERENCES crafts (id) ON DELETE CASCADE,
      revision_id uuid NOT NULL REFERENCES revisions (id) ON DELETE CASCADE,
      created_by_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
      file_name text NOT NULL,
      preview jsonb NOT NULL,
      steps jsonb NOT NULL,
      state text NOT NULL DEFAULT 'pending' CHECK (state IN ('pending', 'accepted')),
      study_id uuid REFERENCES revisions (id) ON DELETE SET NULL,
      expires_at timestamptz NOT NULL,
      accepted_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX imports_craft_idx ON imports (craft_id, created_by_id, created_at DESC);
  `);
};

export const down: Migration = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query('DROP TABLE imports');
};
