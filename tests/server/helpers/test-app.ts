import crypto from 'node:crypto';
import { Client } from 'pg';
import type { Express } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { createApp } from '@/server/app';
import { createDatabase } from '@/server/db';
import { loadConfig, type Config } from '@/server/env';
import { createMailer } from '@/server/services/mailer';
import { createSheetEvents, type SheetEvents } from '@/server/services/sheet-events';

/** What `npm test` (server/dev/stack.ts) tells the tests about the stack it started. */
export const testStack = z
  .object({
    TEST_ADMIN_DATABASE_URL: z.string({ message: 'run the tests through `npm test`, which starts PostgreSQL and the fakes' }),
    TEST_TEMPLATE_DATABASE: z.string(),
    TEST_APP_URL: z.string(),
    TEST_MAIL_INBOX_URL: z.string(),
    TEST_SKIP_BROWSER: z.enum(['0', '1']).default('0'),
  })
  .parse(process.env);

async function adminQuery(sql: string) {
  const client = new Client({ connectionString: testStack.TEST_ADMIN_DATABASE_URL });
  await client.connect();
  try {
    await client.query(sql);
  } finally {
    await client.end();
  }
}

export interface TestApp {
  app: Express;
  sequelize: Sequelize;
  config: Config;
  events: SheetEvents;
  /** Another app on the same database with a changed configuration, built by the real app factory (closed with this one). */
  appWith(change: (config: Config) => Config): Express;
  close(): Promise<void>;
}

/** An app on a fresh database copied from the migrated, seeded template; close() drops it. */
export async function createTestApp(): Promise<TestApp> {
  const name = `t_${crypto.randomBytes(6).toString('hex')}`;
  await adminQuery(`CREATE DATABASE "${name}" TEMPLATE "${testStack.TEST_TEMPLATE_DATABASE}"`);
  const databaseUrl = new URL(testStack.TEST_ADMIN_DATABASE_URL);
  databaseUrl.pathname = `/${name}`;
  const config: Config = { ...loadConfig(process.env), databaseUrl: databaseUrl.toString() };
  const sequelize = createDatabase(config);
  const mailer = createMailer(config.smtp);
  const events = createSheetEvents(config.databaseUrl);
  const app = createApp({ config, sequelize, mailer, events });
  const mailers = [mailer];
  return {
    app,
    sequelize,
    config,
    events,
    appWith: (change) => {
      const changed = change(config);
      const ownMailer = createMailer(changed.smtp);
      mailers.push(ownMailer);
      return createApp({ config: changed, sequelize, mailer: ownMailer, events });
    },
    close: async () => {
      for (const each of mailers) each.close();
      await events.close();
      await sequelize.close();
      await adminQuery(`DROP DATABASE "${name}" WITH (FORCE)`);
    },
  };
}
