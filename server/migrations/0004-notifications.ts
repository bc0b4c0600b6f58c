import type { Migration } from '../migrator';

/**
 * Notifications: what each person is told (the in-app list), the mail outbox a worker sends from (written
 * in the transaction of the change, so a mail server that is down loses nothing), and which kinds of mail
 * each person has turned off.
 */
export const up: Migration = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query(`
    CREATE TABLE notifications (
      id uuid PRIMARY KEY,
      user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
      craft_id uuid REFERENCES crafts (id) ON DELETE CASCADE,
      kind text NOT NULL CHECK (kind IN ('baseline_locked', 'study_promoted', 'row_changed')),
      title text NOT NULL,
      body text NOT NULL,
      actor_id uuid REFERENCES users (id) ON DELETE SET NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      read_at timestamptz,
      -- When the notification went into a mail (or was not to be mailed); null while it waits for a digest.
      mailed_at timestamptz
    );
    CREATE INDEX notifications_user_idx ON notifications (user_id, created_at DESC);
    CREATE INDEX notifications_unmailed_idx ON notifications (user_id, created_at) WHERE mailed_at IS NULL;

    CREATE TABLE mail_outbox (
      id uuid PRIMARY KEY,
      to_address text NOT NULL,
      subject text NOT NULL,
      text text NOT NULL,
      attempts integer NOT NULL DEFAULT 0,
      next_attempt_at timestamptz NOT NULL DEFAULT now(),
      last_error text,
      sent_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX mail_outbox_due_idx ON mail_outbox (next_attempt_at) WHERE sent_at IS NULL;

    CREATE TABLE mail_preferences (
      user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
      kind text NOT NULL CHECK (kind IN ('baseline_locked', 'study_promoted', 'row_changed')),
      mail boolean NOT NULL,
      PRIMARY KEY (user_id, kind)
    );
  `);
};

export const down: Migration = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query(`
    DROP TABLE mail_preferences;
    DROP TABLE mail_outbox;
    DROP TABLE notifications;
  `);
};
