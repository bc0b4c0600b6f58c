import crypto from 'node:crypto';
import { HISTORY_LIMIT, type RowHistory } from '@/shared/schemas/history';
import { patchRow, readDraft, rowOf, type Session } from '../helpers/sheet';
import { revisionLabelled, setUpTern } from './tern';

jest.setTimeout(30_000);

const tern = setUpTern(['tomas', 'amara', 'kenji', 'lucia', 'oren', 'priya']);
const { people } = tern;

const historyPath = (revisionId: string, query = '') => `/api/crafts/${tern.craftId}/revisions/${revisionId}/history${query}`;

async function historyOf(session: Session, revisionId: string, query = ''): Promise<RowHistory> {
  const response = await session.agent.get(historyPath(revisionId, query)).expect(200);
  return response.body as RowHistory;
}

/** Each change as [key, who, revision label]. */
const summary = (history: RowHistory) => history.changes.map((change) => [change.key, change.by?.name, change.revision.label]);

// Tern's seeded story, oldest first: Amara moves deployer_mass to Deployer, Kenji sets the boom's density,
// Tomás locks PDR, Amara grows the sail, Tomás raises the allocation, Kenji opens a study and lightens the deployer.
describe('GET /api/crafts/:craftId/revisions/:revisionId/history', () => {
  it("gives the draft's changes newest first: who, when, the row before and after, in which revision", async () => {
    const draft = await readDraft(people.oren, tern.craftId);
    const history = await historyOf(people.oren, draft.revision.id);
    expect(summary(history)).toEqual([
      ['mass_allocation', 'Tomás Reyes', draft.revision.label],
      ['sail_side', 'Amara Osei', draft.revision.label],
      ['boom_linear_density', 'Kenji Hollis', draft.revision.label],
      ['deployer_mass', 'Amara Osei', draft.revision.label],
    ]);
    expect(history).toEqual(expect.objectContaining({ limit: HISTORY_LIMIT, truncated: false }));
    const times = history.changes.map((change) => Date.parse(change.at));
    expect([...times].sort((a, b) => b - a)).toEqual(times);
    const sail = history.changes[1];
    expect(sail).toEqual(
      expect.objectContaining({
        action: 'update',
        before: expect.objectContaining({ key: 'sail_side', value: 40, unit: 'm', version: 1 }),
        after: expect.objectContaining({ key: 'sail_side', value: 45, unit: 'm', version: 2 }),
        revision: { id: draft.revision.id, kind: 'draft', label: draft.revision.label },
      }),
    );
    const moved = history.changes[3];
    expect([moved?.before?.subsystem, moved?.after?.subsystem]).toEqual(['Booms', 'Deployer']);
  });

  it("gives a baseline the draft's changes up to its lock, made in the draft", async () => {
    const draft = await readDraft(people.tomas, tern.craftId);
    const pdr = await revisionLabelled(people.tomas, tern.craftId, 'PDR');
    const history = await historyOf(people.tomas, pdr.id);
    expect(summary(history)).toEqual([
      ['boom_linear_density', 'Kenji Hollis', draft.revision.label],
      ['deployer_mass', 'Amara Osei', draft.revision.label],
    ]);
    expect(history.changes.every((change) => change.revision.id === draft.revision.id)).toBe(true);
    expect(history.changes.every((change) => Date.parse(change.at) <= Date.parse(pdr.lockedAt ?? ''))).toBe(true);
  });

  it("gives a study its own changes, then its source's up to its opening", async () => {
    const draft = await readDraft(people.kenji, tern.craftId);
    const study = await revisionLabelled(people.kenji, tern.craftId, 'Lighter deployer hinge');
    const history = await historyOf(people.kenji, study.id);
    expect(summary(history)).toEqual([
      ['deployer_mass', 'Kenji Hollis', 'Lighter deployer hinge'],
      ['mass_allocation', 'Tomás Reyes', draft.revision.label],
      ['sail_side', 'Amara Osei', draft.revision.label],
      ['boom_linear_density', 'Kenji Hollis', draft.revision.label],
      ['deployer_mass', 'Amara Osei', draft.revision.label],
    ]);
    expect(history.changes[0]?.after).toEqual(expect.objectContaining({ value: 4.2, unit: 'kg' }));
  });

  it('narrows to one row with key, including the changes it had under the keys it was renamed from', async () => {
    const draft = await readDraft(people.amara, tern.craftId);
    const study = await revisionLabelled(people.kenji, tern.craftId, 'Lighter deployer hinge');
    expect(summary(await historyOf(people.amara, study.id, '?key=deployer_mass'))).toEqual([
      ['deployer_mass', 'Kenji Hollis', 'Lighter deployer hinge'],
      ['deployer_mass', 'Amara Osei', draft.revision.label],
    ]);
    await patchRow(people.amara, draft.path, 'boom_linear_density', {
      version: rowOf(draft, 'boom_linear_density').version,
      key: 'boom_line_density',
    }).expect(200);
    const renamed = await readDraft(people.amara, tern.craftId);
    await patchRow(people.amara, draft.path, 'boom_line_density', {
      version: rowOf(renamed, 'boom_line_density').version,
      value: '16 g/m',
    }).expect(200);
    const history = await historyOf(people.amara, draft.revision.id, '?key=boom_line_density');
    expect(history.changes.map((change) => [change.action, change.key, change.by?.name])).toEqual([
      ['update', 'boom_line_density', 'Amara Osei'],
      ['rename', 'boom_line_density', 'Amara Osei'],
      ['update', 'boom_linear_density', 'Kenji Hollis'],
    ]);
    expect(history.changes[1]?.before?.key).toEqual('boom_linear_density');
    // The baseline's history stops at its lock: neither change of today is in it.
    const pdr = await revisionLabelled(people.amara, tern.craftId, 'PDR');
    expect(summary(await historyOf(people.amara, pdr.id, '?key=boom_linear_density'))).toEqual([
      ['boom_linear_density', 'Kenji Hollis', draft.revision.label],
    ]);
    expect((await historyOf(people.amara, pdr.id, '?key=boom_line_density')).changes).toEqual([]);
  });

  it('gives a partner only the changes of rows in the subsystems shared with them', async () => {
    const draft = await readDraft(people.lucia, tern.craftId);
    const history = await historyOf(people.lucia, draft.revision.id);
    expect(history.changes.length).toBeGreaterThan(0);
    expect(history.changes.every((change) => change.key === 'sail_side')).toBe(true);
    expect(history.changes.every((change) => change.before?.subsystem === 'Sail membrane')).toBe(true);
    expect((await historyOf(people.lucia, draft.revision.id, '?key=mass_allocation')).changes).toEqual([]);
    const pdr = await revisionLabelled(people.lucia, tern.craftId, 'PDR');
    expect((await historyOf(people.lucia, pdr.id)).changes).toEqual([]);
  });

  it('is 404 for a revision the craft does not have and for a craft of another organisation', async () => {
    const draft = await readDraft(people.tomas, tern.craftId);
    await people.tomas.agent.get(historyPath(crypto.randomUUID())).expect(404);
    await people.priya.agent.get(historyPath(draft.revision.id)).expect(404);
    await people.tomas.agent.get(`/api/crafts/${crypto.randomUUID()}/revisions/${draft.revision.id}/history`).expect(404);
  });

  it('refuses a key that is no row key, and unknown query fields, with 400 naming them', async () => {
    const draft = await readDraft(people.tomas, tern.craftId);
    const badKey = await people.tomas.agent.get(historyPath(draft.revision.id, '?key=not%20a%20key')).expect(400);
    expect(badKey.body.error).toEqual(
      expect.objectContaining({ code: 'invalid_input', details: [expect.objectContaining({ path: 'query.key' })] }),
    );
    await people.tomas.agent.get(historyPath(draft.revision.id, '?since=yesterday')).expect(400);
    await people.tomas.agent.get(`/api/crafts/${tern.craftId}/revisions/not-an-id/history`).expect(400);
  });

  it(`gives the ${HISTORY_LIMIT} newest changes and says when there were more`, async () => {
    const draft = await readDraft(people.tomas, tern.craftId);
    const { subsystemId: _subsystemId, updatedBy: _updatedBy, updatedAt: _updatedAt, ...row } = rowOf(draft, 'sail_side');
    for (let step = 0; step < 2; step += 1) {
      // Many changes at once, written as the write path writes them (one entry a change), far in the future.
      await tern.testApp.sequelize.query(
        `INSERT INTO parameter_changes (id, revision_id, key, action, before, after, changed_by_id, changed_at)
         SELECT gen_random_uuid(), $1, 'sail_side', 'update', $2::jsonb, $2::jsonb, NULL, now() + make_interval(days => n + $3)
         FROM generate_series(1, $4::int) AS n`,
        { bind: [draft.revision.id, JSON.stringify(row), step * HISTORY_LIMIT, HISTORY_LIMIT / 2 + 1] },
      );
    }
    const history = await historyOf(people.tomas, draft.revision.id);
    expect(history.changes).toHaveLength(HISTORY_LIMIT);
    expect(history.truncated).toBe(true);
    expect(history.changes[0]?.by).toBeNull();
    expect(history.changes.some((change) => change.key === 'mass_allocation')).toBe(false);
    expect((await historyOf(people.tomas, draft.revision.id, '?key=sail_side')).truncated).toBe(true);
  });
});
