/**
 * The yardstick of the load benchmark: the least an Express 5 + PostgreSQL endpoint can do on this machine,
 * `GET /select-one` answering `SELECT 1` from a pg pool as large as the app's. Run as its own process by
 * tests/bench/server.ts with the app's settings (DATABASE_URL, PORT, HOST, DATABASE_POOL_MAX).
 */
import express from 'express';
import { Pool } from 'pg';
import { loadConfig } from '@/server/env';

const config = loadConfig();
const pool = new Pool({ connectionString: config.databaseUrl, max: config.databasePoolMax });
const app = express();
app.get('/select-one', async (_req, res) => {
  const result = await pool.query<{ one: number }>('SELECT 1 AS one');
  res.json(result.rows[0]);
});
const server = app.listen(config.port, config.host);
process.on('SIGTERM', () => {
  server.close(() => void pool.end().then(() => process.exit(0)));
});
