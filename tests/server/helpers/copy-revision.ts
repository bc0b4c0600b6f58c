import crypto from 'node:crypto';
import type { Sequelize } from 'sequelize';

/**
 * Copies a revision with its rows into a new baseline of the same craft with plain SQL, then locks it: a
 * second revision to compare with, independent of the routes that lock baselines. Returns its id.
 */
export async function copyAsBaseline(sequelize: Sequelize, revisionId: string, label: string): Promise<string> {
  const id = crypto.randomUUID();
  await sequelize.transaction(async (transaction) => {
    await sequelize.query(
      `INSERT INTO revisions (id, craft_id, kind, state, parent_id, label, sheet_name, budget_preset, required_margin_percent, created_by_id)
       SELECT $2::uuid, craft_id, 'baseline', 'open', id, $3::text, sheet_name, budget_preset, required_margin_percent, created_by_id
       FROM revisions WHERE id = $1`,
      { bind: [revisionId, id, label], transaction },
    );
    await sequelize.query(
      `INSERT INTO revision_parameters (id, revision_id, subsystem_id, key, position, label, unit, value, formula, material, mass, note,
         source, protected, role, updated_by_id)
       SELECT gen_random_uuid(), $2::uuid, subsystem_id, key, position, label, unit, value, formula, material, mass, note,
         source, protected, role, updated_by_id
       FROM revision_parameters WHERE revision_id = $1`,
      { bind: [revisionId, id], transaction },
    );
    await sequelize.query(`UPDATE revisions SET state = 'locked', locked_at = now() WHERE id = $1`, { bind: [id], transaction });
  });
  return id;
}
