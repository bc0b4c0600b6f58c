import { createDatabase } from '@/server/db';
import { insertRows } from '@/server/models/sheet-rows';
import { ensureSubsystems } from '@/server/services/sheet-store';
import { syntheticSheet } from '@/tests/bench/synthetic-sheet';
import { createCraft, getRevision, type ApiSession } from './api';

/**
 * A craft with a sheet of `size` rows for the benchmarks: created from the square-sail template through
 * the API (so its headline figures and roles are those of a real craft), then filled up to `size` rows
 * with synthetic ones (tests/bench/synthetic-sheet.ts) through the server's row store, since adding
 * thousands of rows one request at a time would take longer than the benchmarks themselves.
 */
export async function createLargeCraft(
  api: ApiSession,
  databaseUrl: string,
  size: number,
): Promise<{ craftId: string; revisionId: string }> {
  const craft = await createCraft(api, `Benchmark craft of ${size.toLocaleString('en')} rows`, 'square-sail');
  const revisionId = craft.draftRevisionId;
  const templateRows = (await getRevision(api, craft.id, revisionId)).sheet.parameters.length;
  const synthetic = syntheticSheet(size - templateRows).parameters;

  const sequelize = createDatabase({ databaseUrl, databasePoolMax: 1 });
  try {
    await sequelize.transaction(async (transaction) => {
      const names = [...new Set(synthetic.map((parameter) => parameter.subsystem))];
      const subsystemIds = await ensureSubsystems(sequelize, craft.id, names, transaction);
      const rows = synthetic.map((parameter, index) => ({
        parameter,
        subsystemId: subsystemIds.get(parameter.subsystem) ?? '',
        position: templateRows + index + 1,
      }));
      await insertRows(sequelize, revisionId, rows, null, transaction);
    });
  } finally {
    await sequelize.close();
  }
  return { craftId: craft.id, revisionId };
}
