import { User } from '@/server/models';
import { csvCell } from '@/server/services/audit';
import type { AuditEvent } from '@/shared/schemas/audit';
import { readDraft, type Session } from '../helpers/sheet';
import { post, revisionLabelled, setUpTern } from './tern';

jest.setTimeout(30_000);

const tern = setUpTern(['tomas', 'amara', 'kenji', 'ines', 'priya']);
const { people } = tern;

const auditPath = () => `/api/crafts/${tern.craftId}/audit`;

async function auditOf(session: Session, query = ''): Promise<AuditEvent[]> {
  const response = await session.agent.get(`${auditPath()}${query}`).expect(200);
  return response.body.events as AuditEvent[];
}

async function idOf(email: string) {
  return (await User.findOne({ where: { email }, rejectOnEmpty: true })).id;
}

describe('GET /api/crafts/:craftId/audit', () => {
  it("holds the seeded story's lock and study, newest first", async () => {
    const events = await auditOf(people.tomas);
    expect(events.map((event) => [event.action, event.subject, event.actor?.name])).toEqual([
      ['study_opened', 'Lighter deployer hinge', 'Kenji Hollis'],
      ['baseline_locked', 'PDR', 'Tomás Reyes'],
    ]);
    const pdr = await revisionLabelled(people.tomas, tern.craftId, 'PDR');
    expect(events[1]?.details).toEqual(expect.objectContaining({ revisionId: pdr.id, rows: expect.any(Number) }));
  });

  it('is for organisation admins and chief engineers: others on the craft 403, another organisation 404', async () => {
    await people.ines.agent.get(auditPath()).expect(200);
    await people.amara.agent.get(auditPath()).expect(403);
    await people.kenji.agent.get(auditPath()).expect(403);
    await people.priya.agent.get(auditPath()).expect(404);
  });

  it('records locks, studies, promotions, role changes and the tokens of members, each with who and what', async () => {
    const draft = await readDraft(people.tomas, tern.craftId);
    await post(people.tomas, `/api/crafts/${tern.craftId}/revisions/${draft.revision.id}/lock`, {
      label: 'SRR',
      note: 'Systems review.',
    }).expect(201);
    const study = await post(people.amara, `/api/crafts/${tern.craftId}/revisions/${draft.revision.id}/studies`, {
      name: 'Audit study',
    }).expect(201);
    await post(people.tomas, `/api/crafts/${tern.craftId}/revisions/${study.body.id}/promote`, {}).expect(200);
    const orenId = await idOf('oren.vasquez@corvid-sailworks.example');
    await people.ines.agent
      .put(`/api/crafts/${tern.craftId}/members/${orenId}`)
      .set('x-csrf-token', people.ines.csrfToken)
      .send({ role: 'subsystem_owner', subsystems: ['Optics'] })
      .expect(200);
    // The same role again changes nothing and records nothing.
    await people.ines.agent
      .put(`/api/crafts/${tern.craftId}/members/${orenId}`)
      .set('x-csrf-token', people.ines.csrfToken)
      .send({ role: 'subsystem_owner', subsystems: ['Optics'] });
    await people.ines.agent.delete(`/api/crafts/${tern.craftId}/members/${orenId}`).set('x-csrf-token', people.ines.csrfToken).expect(204);
    const token = await post(people.kenji, '/api/account/tokens', { name: 'Boom loads script', scope: 'read' }).expect(201);
    await people.kenji.agent.delete(`/api/account/tokens/${token.body.token.id}`).set('x-csrf-token', people.kenji.csrfToken).expect(204);
    // Priya's token is of another organisation and craft: never in Tern's log.
    await post(people.priya, '/api/account/tokens', { name: 'Skerry script', scope: 'read' }).expect(201);

    const events = await auditOf(people.ines);
    expect(events.slice(0, 7).map((event) => [event.action, event.subject, event.actor?.name])).toEqual([
      ['token_revoked', 'Boom loads script', 'Kenji Hollis'],
      ['token_created', 'Boom loads script', 'Kenji Hollis'],
      ['role_changed', 'Oren Vasquez', 'Ines Marlowe'],
      ['role_changed', 'Oren Vasquez', 'Ines Marlowe'],
      ['study_promoted', 'Audit study', 'Tomás Reyes'],
      ['study_opened', 'Audit study', 'Amara Osei'],
      ['baseline_locked', 'SRR', 'Tomás Reyes'],
    ]);
    expect(events[2]?.details).toEqual({
      userId: orenId,
      before: { role: 'subsystem_owner', subsystems: ['Optics'] },
      after: null,
    });
    expect(events[3]?.details).toEqual({
      userId: orenId,
      before: { role: 'viewer', subsystems: [] },
      after: { role: 'subsystem_owner', subsystems: ['Optics'] },
    });
    expect(events[1]?.details).toEqual(expect.objectContaining({ tokenId: token.body.token.id, scope: 'read' }));
    expect(events[4]?.details).toEqual(expect.objectContaining({ revisionId: study.body.id, applied: [] }));
    expect(JSON.stringify(events)).not.toContain('Skerry script');
  });

  it('filters by action, actor and time, and names bad filters in a 400', async () => {
    expect((await auditOf(people.tomas, '?action=baseline_locked')).every((event) => event.action === 'baseline_locked')).toBe(true);
    const kenjiId = await idOf('kenji.hollis@corvid-sailworks.example');
    const byKenji = await auditOf(people.tomas, `?actor=${kenjiId}`);
    expect(byKenji.length).toBeGreaterThan(0);
    expect(byKenji.every((event) => event.actor?.id === kenjiId)).toBe(true);
    expect(await auditOf(people.tomas, '?to=2000-01-01')).toEqual([]);
    expect(await auditOf(people.tomas, '?from=2999-01-01T00:00:00Z')).toEqual([]);
    const today = new Date().toISOString().slice(0, 10);
    expect((await auditOf(people.tomas, `?from=${today}&to=${today}&limit=1`)).length).toBe(1);

    const bad = await people.tomas.agent.get(`${auditPath()}?action=deleted&from=yesterday&to=0000-01-01&colour=red`).expect(400);
    expect(bad.body.error.details.map((problem: { path: string }) => problem.path).sort()).toEqual([
      'query',
      'query.action',
      'query.from',
      'query.to',
    ]);
  });

  it('exports CSV (format=csv or Accept: text/csv), escaping cells and keeping formulas inert', async () => {
    const draft = await readDraft(people.tomas, tern.craftId);
    await post(people.tomas, `/api/crafts/${tern.craftId}/revisions/${draft.revision.id}/lock`, {
      label: '=HYPERLINK("http://example.invalid","PDR, final")',
      note: 'line one\nline two',
    }).expect(201);
    const response = await people.tomas.agent.get(`${auditPath()}?format=csv&action=baseline_locked`).expect(200);
    expect(response.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(response.headers['content-disposition']).toMatch(/^attachment; filename="?trimsheet-audit.csv"?$/);
    const lines = response.text.split('\r\n');
    expect(lines[0]).toBe('at,action,actor,actor_id,subject,details');
    expect(lines[1]).toContain(',baseline_locked,Tomás Reyes,');
    expect(lines[1]).toContain(`,"'=HYPERLINK(""http://example.invalid"",""PDR, final"")",`);
    expect(lines.at(-1)).toBe('');

    const negotiated = await people.tomas.agent.get(`${auditPath()}?action=baseline_locked`).set('accept', 'text/csv').expect(200);
    expect(negotiated.text).toBe(response.text);
  });
});

describe('csvCell', () => {
  it.each([
    ['plain', 'plain'],
    ['a, b', '"a, b"'],
    ['say "hi"', '"say ""hi"""'],
    ['two\nlines', '"two\nlines"'],
    ['=1+2', "'=1+2"],
    ['+44 20', "'+44 20"],
    ['-3', "'-3"],
    ['@SUM(A1)', "'@SUM(A1)"],
    ['\t=1', "'\t=1"],
    [' padded', '" padded"'],
  ])('writes %j as %j', (text, cell) => {
    expect(csvCell(text)).toBe(cell);
  });
});
