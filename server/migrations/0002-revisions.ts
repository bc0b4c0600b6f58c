import type { Migration } from '../migrator';

/**
 * Sheets in PostgreSQL: subsystems as records, revisions (the working draft now; locked baselines and
 * studies later), one table row per parameter row with its own version, the history of row changes and
 * personal access tokens. Memberships name subsystems by id from here on (the names they held become
 * subsystem records of their craft), so renaming a subsystem keeps its owners.
 */
export const up: Migration = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query(`
    ALTER TABLE crafts ADD COLUMN template_id text NOT NULL DEFAULT 'square-sail';

    CREATE TABLE subsystems (
      id uuid PRIMARY KEY,
      craft_id uuid NOT NULL REFERENCES crafts (id) ON DELETE CASCADE,
      name text NOT NULL,
      position integer NOT NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (craft_id, name)
    );

    ALTER TABLE memberships ADD COLUMN subsystem_ids uuid[] NOT NULL DEFAULT '{}';
    INSERT INTO subsystems (id, craft_id, name, position)
      SELECT gen_random_uuid(), named.craft_id, named.name, (row_number() OVER (PARTITION BY named.craft_id ORDER BY named.name))::integer
      FROM (SELECT DISTINCT craft_id, unnest(subsystems) AS name FROM memberships) AS named;
    UPDATE memberships m SET subsystem_ids = ARRAY(
      SELECT s.id FROM unnest(m.subsystems) AS wanted (name) JOIN subsystems s ON s.craft_id = m.craft_id AND s.name = wanted.name
    );
    ALTER TABLE memberships DROP COLUMN subsystems;

    CREATE TABLE revisions (
      id uuid PRIMARY KEY,
      craft_id uuid NOT NULL REFERENCES crafts (id) ON DELETE CASCADE,
      kind text NOT NULL CHECK (kind IN ('draft', 'baseline', 'study')),
      state text NOT NULL DEFAULT 'open' CHECK (state IN ('open', 'locked')),
      parent_id uuid REFERENCES revisions (id) ON DELETE SET NULL,
      label text NOT NULL,
      note text NOT NULL DEFAULT '',
      sheet_name text NOT NULL,
      budget_preset text,
      required_margin_percent double precision,
      created_by_id uuid REFERENCES users (id) ON DELETE SET NULL,
      locked_by_id uuid REFERENCES users (id) ON DELETE SET NULL,
      locked_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      CHECK ((state = 'locked') = (locked_at IS NOT NULL))
    );
    CREATE INDEX revisions_craft_idx ON revisions (craft_id, created_at);
    -- One working draft per craft.
    CREATE UNIQUE INDEX revisions_one_draft_idx ON revisions (craft_id) WHERE kind = 'draft';

    CREATE TABLE revision_parameters (
      id uuid PRIMARY KEY,
      revision_id uuid NOT NULL REFERENCES revisions (id) ON DELETE CASCADE,
      subsystem_id uuid NOT NULL REFERENCES subsystems (id) ON DELETE RESTRICT,
      key text NOT NULL,
      position integer NOT NULL,
      label text NOT NULL,
      unit text NOT NULL,
      value double precision,
      formula text,
      material jsonb,
      mass jsonb,
      note text,
      source text,
      protected boolean NOT NULL DEFAULT false,
      role text,
      version integer NOT NULL DEFAULT 1 CHECK (version >= 1),
      updated_by_id uuid REFERENCES users (id) ON DELETE SET NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (revision_id, key),
      CHECK (num_nonnulls(value, formula, material) = 1)
    );
    CREATE INDEX revision_parameters_order_idx ON revision_parameters (revision_id, position);
    CREATE INDEX revision_parameters_subsystem_idx ON revision_parameters (subsystem_id);

    CREATE TABLE parameter_changes (
      id uuid PRIMARY KEY,
      revision_id uuid NOT NULL REFERENCES revisions (id) ON DELETE CASCADE,
      key text NOT NULL,
      action text NOT NULL CHECK (action IN ('create', 'update', 'rename', 'move', 'delete')),
      before jsonb,
      after jsonb,
      changed_by_id uuid REFERENCES users (id) ON DELETE SET NULL,
      changed_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX parameter_changes_revision_idx ON parameter_changes (revision_id, changed_at);

    CREATE TABLE access_tokens (
      id uuid PRIMARY KEY,
      user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
      name text NOT NULL,
      scope text NOT NULL CHECK (scope IN ('read', 'read_write')),
      token_hash text NOT NULL UNIQUE,
      prefix text NOT NULL,
      last_used_at timestamptz,
      revoked_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX access_tokens_user_idx ON access_tokens (user_id);
  `);
};

export const down: Migration = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query(`
    DROP TABLE access_tokens;
    DROP TABLE parameter_changes;
    DROP TABLE revision_parameters;
    DROP TABLE revisions;
    ALTER TABLE memberships ADD COLUMN subsystems text[] NOT NULL DEFAULT '{}';
    UPDATE memberships m SET subsystems = ARRAY(SELECT s.name FROM subsystems s WHERE s.id = ANY (m.subsystem_ids));
    ALTER TABLE memberships DROP COLUMN subsystem_ids;
    DROP TABLE subsystems;
    ALTER TABLE crafts DROP COLUMN template_id;
  `);
};
