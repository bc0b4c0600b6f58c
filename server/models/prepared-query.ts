import crypto from 'node:crypto';
import type { Client, QueryResultRow } from 'pg';
import type { Sequelize } from 'sequelize';

/** Statement names by SQL text: one name per distinct text, so a name never stands for two statements. */
const statementNames = new Map<string, string>();

function statementName(text: string): string {
  let name = statementNames.get(text);
  if (name === undefined) {
    name = `trimsheet_${crypto.createHash('sha256').update(text).digest('hex').slice(0, 24)}`;
    statementNames.set(text, name);
  }
  return name;
}

/** A connection of Sequelize's pool: a pg Client, which the pool replaces once it is marked invalid. */
type PooledClient = Client & { _invalid?: boolean };

/** The two calls of Sequelize's pool a read needs; its typings call the connection `object`. */
interface PgPool {
  getConnection(options: { type: 'SELECT' }): Promise<PooledClient>;
  releaseConnection(connection: PooledClient): void;
}

/** SQLSTATE of "cached plan must not change result type": a column the statement reads changed type under it. */
const FEATURE_NOT_SUPPORTED = '0A000';

/**
 * Runs a read as a named prepared statement on a connection of Sequelize's pool, binds as `$1, $2, …`.
 * PostgreSQL parses and plans the statement once per connection instead of on every call (on the revision
 * GET, planning cost more than running), and the call skips Sequelize's per-query work. For hot reads outside
 * transactions; results are parsed with the same type parsers as Sequelize's own queries.
 */
export async function preparedQuery<Row extends QueryResultRow>(sequelize: Sequelize, text: string, values: unknown[]): Promise<Row[]> {
  const pool = sequelize.connectionManager as unknown as PgPool;
  const connection = await pool.getConnection({ type: 'SELECT' });
  try {
    return (await connection.query<Row>({ name: statementName(text), text, values })).rows;
  } catch (error) {
    // After a migration on a running API the statement fails on its connection for as long as that lives:
    // let the pool replace the connection, so that the next call prepares the statement afresh.
    if ((error as { code?: unknown }).code === FEATURE_NOT_SUPPORTED) connection._invalid = true;
    throw error;
  } finally {
    pool.releaseConnection(connection);
  }
}
