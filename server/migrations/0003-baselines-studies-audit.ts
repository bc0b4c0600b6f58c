import type { Migration } from '../migrator';

/**
 * Locked baselines, studies and the audit log. A locked revision never changes: triggers refuse UPDATE and
 * DELETE of a locked `revisions` record, and INSERT, UPDATE and DELETE of `revision_parameters` rows of a
 * locked revision, whoever sends the statement. A study keeps the rows of its source as they were when it
 * was opened (`branch_base`), the base of the three-way merge that promotes it. `audit_events` records
 * locks, studies, promotions, role changes and access tokens.
 */
export const up: Migration = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query(`
    ALTER TABLE revisions ADD COLUMN branch_base jsonb;
    ALTER TABLE revisions ADD CONSTRAINT revisions_branch_base_check CHECK ((kind = 'study') = (branch_base IS NOT NULL));
    -- A baseline's label names one design review of the craft.
    CREATE UNIQUE INDEX revisions_baseline_label_idx ON revisions (craft_id, lower(label)) WHERE kind = 'baseline';

    CREATE FUNCTION refuse_change_of_locked_revision() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF OLD.state = 'locked' THEN
        RAISE EXCEPTION 'revision % is locked: it cannot be changed or deleted', OLD.id
          USING ERRCODE = 'object_not_in_prerequisite_state';
      END IF;
      IF TG_OP = 'DELETE' THEN
        RETURN OLD;
      END IF;
      RETURN NEW;
    END $$;
    CREATE TRIGGER revisions_locked_guard BEFORE UPDATE OR DELETE ON revisions
      FOR EACH ROW EXECUTE FUNCTION refuse_change_of_locked_revision();

    -- Statement-level checks over the transition tables: a bulk insert of a new revision's rows costs one join, not a look-up a row.
    CREATE FUNCTION refuse_rows_of_locked_revision(locked_id uuid) RETURNS void LANGUAGE plpgsql AS $$
    BEGIN
      IF locked_id IS NOT NULL THEN
        RAISE EXCEPTION 'revision % is locked: its rows cannot change', locked_id
          USING ERRCODE = 'object_not_in_prerequisite_state';
      END IF;
    END $$;
    CREATE FUNCTION refuse_insert_into_locked_revision() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      PERFORM refuse_rows_of_locked_revision(
        (SELECT r.id FROM new_rows n JOIN revisions r ON r.id = n.revision_id WHERE r.state = 'locked' LIMIT 1));
      RETURN NULL;
    END $$;
    CREATE FUNCTION refuse_update_in_locked_revision() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      PERFORM refuse_rows_of_locked_revision(
        (SELECT r.id FROM (SELECT revision_id FROM old_rows UNION SELECT revision_id FROM new_rows) AS touched
           JOIN revisions r ON r.id = touched.revision_id WHERE r.state = 'locked' LIMIT 1));
      RETURN NULL;
    END $$;
    CREATE FUNCTION refuse_delete_from_locked_revision() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      PERFORM refuse_rows_of_locked_revision(
        (SELECT r.id FROM old_rows o JOIN revisions r ON r.id = o.revision_id WHERE r.state = 'locked' LIMIT 1));
      RETURN NULL;
    END $$;
    CREATE TRIGGER revision_parameters_locked_insert AFTER INSERT ON revision_parameters
      REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION refuse_insert_into_locked_revision();
    CREATE TRIGGER revision_parameters_locked_update AFTER UPDATE ON revision_parameters
      REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION refuse_update_in_locked_revision();
    CREATE TRIGGER revision_parameters_locked_delete AFTER DELETE ON revision_parameters
      REFERENCING OLD TABLE AS old_rows FOR EACH STATEMENT EXECUTE FUNCTION refuse_delete_from_locked_revision();

    CREATE TABLE audit_events (
      id uuid PRIMARY KEY,
      organisation_id uuid NOT NULL REFERENCES organisations (id) ON DELETE CASCADE,
      -- Null for what belongs to a person rather than a craft (their access tokens).
      craft_id uuid REFERENCES crafts (id) ON DELETE CASCADE,
      actor_id uuid REFERENCES users (id) ON DELETE SET NULL,
      action text NOT NULL,
      subject text NOT NULL,
      details jsonb NOT NULL DEFAULT '{}',
      at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX audit_events_craft_idx ON audit_events (craft_id, at);
    CREATE INDEX audit_events_personal_idx ON audit_events (organisation_id, actor_id, at) WHERE craft_id IS NULL;
  `);
};

export const down: Migration = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query(`
    DROP TABLE audit_events;
    DROP TRIGGER revision_parameters_locked_delete ON revision_parameters;
    DROP TRIGGER revision_parameters_locked_update ON revision_parameters;
    DROP TRIGGER revision_parameters_locked_insert ON revision_parameters;
    DROP FUNCTION refuse_delete_from_locked_revision();
    DROP FUNCTION refuse_update_in_locked_revision();
    DROP FUNCTION refuse_insert_into_locked_revision();
    DROP FUNCTION refuse_rows_of_locked_revision(uuid);
    DROP TRIGGER revisions_locked_guard ON revisions;
    DROP FUNCTION refuse_change_of_locked_revision();
    DROP INDEX revisions_baseline_label_idx;
    ALTER TABLE revisions DROP CONSTRAINT revisions_branch_base_check;
    ALTER TABLE revisions DROP COLUMN branch_base;
  `);
};
