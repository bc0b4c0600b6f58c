import { QueryTypes } from 'sequelize';
import type { SheetEvent } from '@/shared/schemas/revisions';
import { patchRow, readDraft, rowOf, type Session } from '../helpers/sheet';
import { listRevisions, post, readRevision, revisionLabelled, setUpTern } from './tern';

jest.setTimeout(30_000);

const tern = setUpTern(['tomas', 'amara', 'kenji', 'lucia', 'oren', 'ines']);
const { people } = tern;

const studiesPath = (revisionId: string) => `/api/crafts/${tern.craftId}/revisions/${revisionId}/studies`;

/** Opens a study of the revision as the person and reads it. */
async function openStudy(session: Session, sourceId: string, name: string) {
  const response = await post(session, studiesPath(sourceId), { name }).expect(201);
  return readRevision(session, tern.craftId, response.body.id as string);
}

describe('POST /api/crafts/:craftId/revisions/:revisionId/studies', () => {
  it("opens a study of a baseline owned by the person, with the baseline's rows", async () => {
    const pdr = await revisionLabelled(people.kenji, tern.craftId, 'PDR');
    const response = await post(people.kenji, studiesPath(pdr.id), { name: 'Longer booms', note: 'What 42 m would need.' }).expect(201);
    expect(response.body).toEqual(
      expect.objectContaining({
        kind: 'study',
        state: 'open',
        label: 'Longer booms',
        note: 'What 42 m would need.',
        parentId: pdr.id,
        createdBy: expect.objectContaining({ name: 'Kenji Hollis' }),
        lockedAt: null,
      }),
    );
    const study = await readRevision(people.kenji, tern.craftId, response.body.id);
    const baseline = await readRevision(people.kenji, tern.craftId, pdr.id);
    expect(study.sheet.parameters).toEqual(baseline.sheet.parameters);
  });

  it('refuses partners, viewers and organisation admins without a role with 403, and writes nothing', async () => {
    const draft = await readDraft(people.tomas, tern.craftId);
    const before = (await listRevisions(people.tomas, tern.craftId)).length;
    for (const session of [people.lucia, people.oren, people.ines])
      await post(session, studiesPath(draft.revision.id), { name: 'Not allowed' }).expect(403);
    expect(await listRevisions(people.tomas, tern.craftId)).toHaveLength(before);
  });

  it('names a missing or overlong name in a 400', async () => {
    const draft = await readDraft(people.tomas, tern.craftId);
    const missing = await post(people.kenji, studiesPath(draft.revision.id), {}).expect(400);
    expect(missing.body.error.details).toEqual([expect.objectContaining({ path: 'body.name' })]);
    const long = await post(people.kenji, studiesPath(draft.revision.id), { name: 'x'.repeat(101) }).expect(400);
    expect(long.body.error.details).toEqual([expect.objectContaining({ path: 'body.name', message: 'must be at most 100 characters' })]);
    await post(people.kenji, studiesPath('00000000-0000-4000-8000-000000000000'), { name: 'Nowhere' }).expect(404);
  });
});

describe('rows of a study', () => {
  it('let its owner edit any row, and systems and chief engineers too; the draft does not change', async () => {
    const draft = await readDraft(people.kenji, tern.craftId);
    const study = await openStudy(people.kenji, draft.revision.id, 'Bigger sail');
    expect(study.abilities.manageRows).toBe(true);
    expect(study.abilities.editableSubsystemIds).toEqual(study.subsystems.map((subsystem) => subsystem.id));

    // Sail side is not one of Kenji's subsystems: in the draft he may not touch it.
    await patchRow(people.kenji, draft.path, 'sail_side', { version: rowOf(draft, 'sail_side').version, value: 47 }).expect(403);
    const mine = await patchRow(people.kenji, study.path, 'sail_side', { version: rowOf(study, 'sail_side').version, value: 47 }).expect(
      200,
    );
    await patchRow(people.amara, study.path, 'sail_side', { version: mine.body.version, value: 48 }).expect(200);
    await patchRow(people.tomas, study.path, 'cone_angle', { version: rowOf(study, 'cone_angle').version, value: 10 }).expect(200);
    await post(people.kenji, `${study.path}/parameters`, {
      parameter: { key: 'hinge_mass', label: 'Hinge mass', subsystem: 'Deployer', unit: 'kg', value: 0.3 },
    }).expect(201);

    const after = await readRevision(people.oren, tern.craftId, study.revision.id);
    expect(rowOf(after, 'sail_side').value).toBe(48);
    expect(rowOf(after, 'hinge_mass').value).toBe(0.3);
    expect(rowOf(await readDraft(people.oren, tern.craftId), 'sail_side').value).toBe(rowOf(draft, 'sail_side').value);
  });

  it("leave others to reading someone else's study, their own subsystem's rows included, and say why", async () => {
    const study = await openStudy(people.amara, (await readDraft(people.amara, tern.craftId)).revision.id, "Amara's trade");
    const asKenji = await readRevision(people.kenji, tern.craftId, study.revision.id);
    expect(asKenji.abilities).toEqual(expect.objectContaining({ editableSubsystemIds: [], manageRows: false }));
    const refused = await patchRow(people.kenji, study.path, 'boom_count', {
      version: rowOf(study, 'boom_count').version,
      value: 5,
    }).expect(403);
    expect(refused.body.error.message).toMatch(/changed by its owner and by systems and chief engineers/);
    await patchRow(people.oren, study.path, 'boom_count', { version: rowOf(study, 'boom_count').version, value: 5 }).expect(403);
    // Partners still see only the rows shared with them.
    const asLucia = await readRevision(people.lucia, tern.craftId, study.revision.id);
    expect(asLucia.sheet.parameters.every((row) => row.subsystem === 'Sail membrane')).toBe(true);
    await patchRow(people.lucia, study.path, 'sail_side', { version: rowOf(study, 'sail_side').version, value: 50 }).expect(403);
    await patchRow(people.lucia, study.path, 'boom_count', { version: rowOf(study, 'boom_count').version, value: 5 }).expect(404);
  });

  it('are evaluated on the server and announced as events of the study', async () => {
    const seeded = await revisionLabelled(people.oren, tern.craftId, 'Lighter deployer hinge');
    const draftEvaluation = await people.oren.agent.get(`${(await readDraft(people.oren, tern.craftId)).path}/evaluation`).expect(200);
    const studyEvaluation = await people.oren.agent.get(`/api/crafts/${tern.craftId}/revisions/${seeded.id}/evaluation`).expect(200);
    // The study's only change: the deployer is 0.8 kg lighter (5 kg in the draft, 4.2 kg in the study).
    expect(studyEvaluation.body.values.deployer_mass.value).toBeCloseTo(4.2, 9);
    expect(draftEvaluation.body.values.total_mass.value - studyEvaluation.body.values.total_mass.value).toBeCloseTo(0.8, 9);

    await tern.testApp.events.ready();
    const heard: SheetEvent[] = [];
    const unsubscribe = tern.testApp.events.subscribe({
      craftId: tern.craftId,
      visibleSubsystems: undefined,
      send: (event) => heard.push(event),
      end: () => undefined,
    });
    try {
      const study = await readRevision(people.kenji, tern.craftId, seeded.id);
      await patchRow(people.kenji, study.path, 'payload_mass', { version: rowOf(study, 'payload_mass').version, value: 2.5 }).expect(200);
      for (let waited = 0; heard.length === 0 && waited < 2000; waited += 20) await new Promise((resolve) => setTimeout(resolve, 20));
    } finally {
      unsubscribe();
    }
    expect(heard).toEqual([expect.objectContaining({ type: 'parameters_changed', revisionId: seeded.id, keys: ['payload_mass'] })]);
  });
});

const promotePath = (studyId: string) => `/api/crafts/${tern.craftId}/revisions/${studyId}/promote`;

async function historyInDraft(draftId: string, key: string) {
  return tern.testApp.sequelize.query<{ action: string; after: { value?: number; version?: number } | null; by: string }>(
    `SELECT c.action, c.after, u.name AS by FROM parameter_changes c JOIN users u ON u.id = c.changed_by_id
     WHERE c.revision_id = $1 AND c.key = $2 ORDER BY c.changed_at, c.id`,
    { bind: [draftId, key], type: QueryTypes.SELECT },
  );
}

describe('POST /api/crafts/:craftId/revisions/:studyId/promote', () => {
  it('applies a study without conflicts to the draft, bumps versions, records history and locks the study', async () => {
    const draft = await readDraft(people.tomas, tern.craftId);
    const study = await openStudy(people.kenji, draft.revision.id, 'Stiffer booms');
    await patchRow(people.kenji, study.path, 'boom_linear_density', {
      version: rowOf(study, 'boom_linear_density').version,
      value: '18 g/m',
    }).expect(200);
    await post(people.kenji, `${study.path}/parameters`, {
      parameter: { key: 'boom_tip_mass', label: 'Boom tip mass', subsystem: 'Booms', unit: 'kg', value: 0.05 },
      before: 'boom_length',
    }).expect(201);
    // Meanwhile the draft moves on elsewhere.
    await patchRow(people.amara, draft.path, 'cone_angle', { version: rowOf(draft, 'cone_angle').version, value: 5 }).expect(200);

    await post(people.kenji, promotePath(study.revision.id), {}).expect(403);
    await post(people.amara, promotePath(study.revision.id), {}).expect(403);
    const response = await post(people.tomas, promotePath(study.revision.id), {}).expect(200);
    expect(response.body.applied).toEqual([
      { key: 'boom_linear_density', action: 'update' },
      { key: 'boom_tip_mass', action: 'create' },
    ]);
    expect(response.body.study).toEqual(
      expect.objectContaining({
        state: 'locked',
        lockedBy: expect.objectContaining({ name: 'Tomás Reyes' }),
        lockedAt: expect.any(String),
      }),
    );

    const after = await readDraft(people.oren, tern.craftId);
    const density = rowOf(draft, 'boom_linear_density');
    expect(rowOf(after, 'boom_linear_density')).toEqual(
      expect.objectContaining({ value: 18, version: density.version + 1, updatedBy: expect.objectContaining({ name: 'Tomás Reyes' }) }),
    );
    expect(rowOf(after, 'boom_tip_mass')).toEqual(expect.objectContaining({ value: 0.05, version: 1 }));
    const keys = after.sheet.parameters.map((row) => row.key);
    expect(keys.indexOf('boom_tip_mass')).toBe(keys.indexOf('boom_length') - 1);
    expect(rowOf(after, 'cone_angle').value).toBe(5);
    expect(await historyInDraft(after.revision.id, 'boom_linear_density')).toEqual([
      expect.objectContaining({ action: 'update', by: 'Kenji Hollis' }),
      expect.objectContaining({
        action: 'update',
        by: 'Tomás Reyes',
        after: expect.objectContaining({ value: 18, version: density.version + 1 }),
      }),
    ]);

    const locked = await patchRow(people.kenji, study.path, 'boom_count', { version: rowOf(study, 'boom_count').version, value: 3 }).expect(
      403,
    );
    expect(locked.body.error.message).toBe('This study was promoted and is locked: its rows cannot change');
    const again = await post(people.tomas, promotePath(study.revision.id), {}).expect(409);
    expect(again.body.error.code).toBe('already_promoted');
  });

  it('lists conflicts and writes nothing until each is resolved, then applies the resolutions', async () => {
    const draft = await readDraft(people.tomas, tern.craftId);
    const study = await openStudy(people.amara, draft.revision.id, 'Sail trade');
    const base = { sail: rowOf(study, 'sail_side'), film: rowOf(study, 'film_thickness'), bus: rowOf(study, 'bus_mass') };
    await patchRow(people.amara, study.path, 'sail_side', { version: base.sail.version, value: 52 }).expect(200);
    await patchRow(people.amara, study.path, 'film_thickness', { version: base.film.version, value: 2 }).expect(200);
    await patchRow(people.amara, study.path, 'bus_mass', { version: base.bus.version, value: 11 }).expect(200);
    await patchRow(people.tomas, draft.path, 'sail_side', { version: base.sail.version, value: 49 }).expect(200);
    await patchRow(people.tomas, draft.path, 'bus_mass', { version: base.bus.version, value: 12 }).expect(200);

    const conflicted = await post(people.tomas, promotePath(study.revision.id), { resolutions: { bus_mass: 'draft' } }).expect(409);
    expect(conflicted.body.error.code).toBe('merge_conflicts');
    expect(conflicted.body.error.details.unresolved).toEqual(['sail_side']);
    expect(conflicted.body.error.details.conflicts).toEqual([
      {
        key: 'sail_side',
        base: expect.objectContaining({ value: base.sail.value, subsystem: 'Sail membrane' }),
        draft: expect.objectContaining({ value: 49 }),
        study: expect.objectContaining({ value: 52 }),
      },
      {
        key: 'bus_mass',
        base: expect.objectContaining({ value: base.bus.value }),
        draft: expect.objectContaining({ value: 12 }),
        study: expect.objectContaining({ value: 11 }),
      },
    ]);
    const untouched = await readDraft(people.tomas, tern.craftId);
    expect(rowOf(untouched, 'film_thickness')).toEqual(rowOf(draft, 'film_thickness'));
    expect((await revisionLabelled(people.tomas, tern.craftId, 'Sail trade')).state).toBe('open');

    const stray = await post(people.tomas, promotePath(study.revision.id), {
      resolutions: { sail_side: 'study', bus_mass: 'draft', cone_angle: 'study' },
    }).expect(400);
    expect(stray.body.error.details).toEqual([{ path: 'body.resolutions.cone_angle', message: 'this row is not in conflict' }]);
    const wrong = await post(people.tomas, promotePath(study.revision.id), { resolutions: { sail_side: 'mine' } }).expect(400);
    expect(wrong.body.error.details).toEqual([expect.objectContaining({ path: 'body.resolutions.sail_side' })]);

    const promoted = await post(people.tomas, promotePath(study.revision.id), {
      resolutions: { sail_side: 'study', bus_mass: 'draft' },
    }).expect(200);
    expect(promoted.body.applied).toEqual([
      { key: 'film_thickness', action: 'update' },
      { key: 'sail_side', action: 'update' },
    ]);
    const after = await readDraft(people.tomas, tern.craftId);
    expect(rowOf(after, 'sail_side').value).toBe(52);
    expect(rowOf(after, 'film_thickness').value).toBe(2);
    expect(rowOf(after, 'bus_mass').value).toBe(12);
  });

  it('refuses a merge that would break the draft (409 merge_breaks_sheet) and writes nothing', async () => {
    const draft = await readDraft(people.tomas, tern.craftId);
    await post(people.tomas, `${draft.path}/parameters`, {
      parameter: { key: 'harness_mass', label: 'Harness', subsystem: 'Spacecraft', unit: 'kg', value: 0.4 },
    }).expect(201);
    const study = await openStudy(people.amara, draft.revision.id, 'No harness');
    await people.amara.agent
      .delete(`${study.path}/parameters/harness_mass?version=1`)
      .set('x-csrf-token', people.amara.csrfToken)
      .expect(204);
    // Meanwhile the draft comes to use the row the study removes.
    await post(people.tomas, `${draft.path}/parameters`, {
      parameter: { key: 'cable_mass', label: 'Cables', subsystem: 'Spacecraft', unit: 'kg', formula: '=harness_mass / 2' },
    }).expect(201);

    const refused = await post(people.tomas, promotePath(study.revision.id), {}).expect(409);
    expect(refused.body.error).toEqual(
      expect.objectContaining({ code: 'merge_breaks_sheet', details: { key: 'cable_mass', code: 'unknown_key' } }),
    );
    expect(rowOf(await readDraft(people.tomas, tern.craftId), 'harness_mass').value).toBe(0.4);
    expect((await revisionLabelled(people.tomas, tern.craftId, 'No harness')).state).toBe('open');
  });

  it('answers 409 not_a_study for a baseline or the draft, and 404 for a revision of no craft of the person', async () => {
    const pdr = await revisionLabelled(people.tomas, tern.craftId, 'PDR');
    expect((await post(people.tomas, promotePath(pdr.id), {}).expect(409)).body.error.code).toBe('not_a_study');
    const draft = await readDraft(people.tomas, tern.craftId);
    expect((await post(people.tomas, promotePath(draft.revision.id), {}).expect(409)).body.error.code).toBe('not_a_study');
    await post(people.tomas, promotePath('00000000-0000-4000-8000-000000000000'), {}).expect(404);
  });
});
