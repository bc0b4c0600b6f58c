import type { Migration } from '../migrator';

/**
 * Rate-limit counters shared by every API process (one row per limit and key, counting hits in a fixed window),
 * and sessions with an absolute end besides the idle one. Counters are UNLOGGED: losing them in a crash only
 * forgives a few hits, and they cost no WAL on every request.
 */
export const up: Migration = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query(`
    CREATE UNLOGGED TABLE rate_limits (
      bucket text NOT NULL,
      key text NOT NULL,
      hits integer NOT NULL,
      window_ends_at timestamptz NOT NULL,
      PRIMARY KEY (bucket, key)
    );
    CREATE INDEX rate_limits_window_ends_at_idx ON rate_limits (window_ends_at);

    ALTER TABLE sessions ALTER COLUMN expire TYPE timestamptz USING expire AT TIME ZONE current_setting('TimeZone');
    ALTER TABLE sessions ADD COLUMN ends_at timestamptz;
    UPDATE sessions SET ends_at = expire;
    ALTER TABLE sessions ALTER COLUMN ends_at SET NOT NULL;
  `);
};

export const down: Migration = async ({ context: queryInterface }) => {
  await queryInterface.sequelize.query(`
    DROP TABLE rate_limits;
    ALTER TABLE sessions DROP COLUMN ends_at;
    ALTER TABLE sessions ALTER COLUMN expire TYPE timestamp(6) USING expire AT TIME ZONE current_setting('TimeZone');
  `);
};
