import type { Migration } from '../migrator';

/**
 * Evidence on rows. `attachments` describes each file (name, sniffed type, size, kind, who and when) and
 * `attachment_contents` holds its bytes apart, so listing never reads them. `row_attachments` links a file
 * to a row of a revision: a copy of the revision (baseline, study) copies the links, never the bytes. A file
 * no row links to any more is deleted with its bytes. A locked revision's links never change, as its rows.
 */
export const up: Migration = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query(`
    CREATE TABLE attachments (
      id uuid PRIMARY KEY,
      craft_id uuid NOT NULL REFERENCES crafts (id) ON DELETE CASCADE,
      name text NOT NULL CHECK (length(name) BETWEEN 1 AND 200),
      media_type text NOT NULL,
      size integer NOT NULL CHECK (size > 0),
      kind text NOT NULL CHECK (kind IN ('datasheet', 'weighing_report', 'test_report', 'other')),
      sha256 bytea NOT NULL,
      uploaded_by_id uuid REFERENCES users (id) ON DELETE SET NULL,
      uploaded_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX attachments_craft_idx ON attachments (craft_id);

    CREATE TABLE attachment_contents (
      attachment_id uuid PRIMARY KEY REFERENCES attachments (id) ON DELETE CASCADE,
      bytes bytea NOT NULL
    );
    -- PDFs, images and spreadsheets are compressed already: store them out of line without trying again.
    ALTER TABLE attachment_contents ALTER COLUMN bytes SET STORAGE EXTERNAL;

    CREATE TABLE row_attachments (
      parameter_id uuid NOT NULL REFERENCES revision_parameters (id) ON DELETE CASCADE,
      attachment_id uuid NOT NULL REFERENCES attachments (id) ON DELETE CASCADE,
      PRIMARY KEY (parameter_id, attachment_id)
    );
    CREATE INDEX row_attachments_attachment_idx ON row_attachments (attachment_id);

    CREATE FUNCTION refuse_links_in_locked_revision() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      PERFORM refuse_rows_of_locked_revision(
        (SELECT r.id FROM changed_links l
           JOIN revision_parameters p ON p.id = l.parameter_id
           JOIN revisions r ON r.id = p.revision_id
         WHERE r.state = 'locked' LIMIT 1));
      RETURN NULL;
    END $$;
    CREATE TRIGGER row_attachments_locked_insert AFTER INSERT ON row_attachments
      REFERENCING NEW TABLE AS changed_links FOR EACH STATEMENT EXECUTE FUNCTION refuse_links_in_locked_revision();
    CREATE TRIGGER row_attachments_locked_delete AFTER DELETE ON row_attachments
      REFERENCING OLD TABLE AS changed_links FOR EACH STATEMENT EXECUTE FUNCTION refuse_links_in_locked_revision();

    -- A file no row links to any more (its last link removed, its row deleted) goes, bytes and all.
    CREATE FUNCTION delete_unlinked_attachments() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      DELETE FROM attachments a
      WHERE a.id IN (SELECT DISTINCT attachment_id FROM unlinked)
        AND NOT EXISTS (SELECT 1 FROM row_attachments l WHERE l.attachment_id = a.id);
      RETURN NULL;
    END $$;
    CREATE TRIGGER row_attachments_unlinked AFTER DELETE ON row_attachments
      REFERENCING OLD TABLE AS unlinked FOR EACH STATEMENT EXECUTE FUNCTION delete_unlinked_attachments();
  `);
};

export const down: Migration = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query(`
    DROP TRIGGER row_attachments_unlinked ON row_attachments;
    DROP FUNCTION delete_unlinked_attachments();
    DROP TRIGGER row_attachments_locked_delete ON row_attachments;
    DROP TRIGGER row_attachments_locked_insert ON row_attachments;
    DROP FUNCTION refuse_links_in_locked_revision();
    DROP TABLE row_attachments;
    DROP TABLE attachment_contents;
    DROP TABLE attachments;
  `);
};
