import { Craft, Membership, User } from '@/server/models';
import { signIn } from '../helpers/sign-in';
import { createTestApp, type TestApp } from '../helpers/test-app';

let testApp: TestApp;
let admin: Awaited<ReturnType<typeof signIn>>;
let chief: Awaited<ReturnType<typeof signIn>>;
let ternId: string;

beforeAll(async () => {
  testApp = await createTestApp();
  admin = await signIn(testApp.app, 'demo-ines', 'sso');
  chief = await signIn(testApp.app, 'demo-tomas', 'google');
  ternId = (await Craft.findOne({ where: { name: 'Tern' }, rejectOnEmpty: true })).id;
});

afterAll(async () => {
  await testApp.close();
});

describe('GET /api/crafts', () => {
  it('lists the crafts a member belongs to, with their role', async () => {
    const response = await chief.agent.get('/api/crafts').expect(200);
    expect(response.body.crafts).toEqual([expect.objectContaining({ name: 'Tern', myRole: 'chief_engineer' })]);
  });
});

describe('POST /api/crafts', () => {
  it('creates a craft and makes its creator chief engineer', async () => {
    const response = await admin.agent
      .post('/api/crafts')
      .set('x-csrf-token', admin.csrfToken)
      .send({ name: '  Petrel  ', description: 'Study craft' })
      .expect(201);
    expect(response.body).toEqual(expect.objectContaining({ name: 'Petrel', myRole: 'chief_engineer' }));
    const membership = await Membership.findOne({ where: { craftId: response.body.id } });
    expect(membership?.role).toBe('chief_engineer');
  });

  it('refuses an empty name field by field, and writes nothing', async () => {
    const before = await Craft.count();
    const response = await admin.agent.post('/api/crafts').set('x-csrf-token', admin.csrfToken).send({ name: '   ' }).expect(400);
    expect(response.body.error).toEqual({
      code: 'invalid_input',
      message: expect.stringContaining('body.name'),
      details: [{ path: 'body.name', message: 'must not be empty' }],
    });
    expect(await Craft.count()).toBe(before);
  });

  it('refuses a body that is not JSON with 400 invalid_json', async () => {
    const response = await admin.agent
      .post('/api/crafts')
      .set('x-csrf-token', admin.csrfToken)
      .set('content-type', 'application/json')
      .send('{"name":')
      .expect(400);
    expect(response.body.error.code).toBe('invalid_json');
  });

  it('refuses a request without the CSRF token', async () => {
    const response = await admin.agent.post('/api/crafts').send({ name: 'No token' }).expect(403);
    expect(response.body.error.code).toBe('invalid_csrf_token');
  });
});

describe('GET /api/crafts/:craftId', () => {
  it('says which parameter is malformed', async () => {
    const response = await chief.agent.get('/api/crafts/not-a-uuid').expect(400);
    expect(response.body.error.details).toEqual([{ path: 'params.craftId', message: 'must be a UUID' }]);
  });
});

describe('PATCH /api/crafts/:craftId', () => {
  it('lets the chief engineer rename the craft', async () => {
    const response = await chief.agent
      .patch(`/api/crafts/${ternId}`)
      .set('x-csrf-token', chief.csrfToken)
      .send({ name: 'Tern A' })
      .expect(200);
    expect(response.body.name).toBe('Tern A');
    await chief.agent.patch(`/api/crafts/${ternId}`).set('x-csrf-token', chief.csrfToken).send({ name: 'Tern' }).expect(200);
  });

  it('refuses an empty change', async () => {
    const response = await chief.agent.patch(`/api/crafts/${ternId}`).set('x-csrf-token', chief.csrfToken).send({}).expect(400);
    expect(response.body.error.code).toBe('invalid_input');
  });
});

describe('PUT and DELETE /api/crafts/:craftId/members/:userId', () => {
  it('requires subsystems for a subsystem owner', async () => {
    const oren = await User.findOne({ where: { email: 'oren.vasquez@corvid-sailworks.example' }, rejectOnEmpty: true });
    const response = await admin.agent
      .put(`/api/crafts/${ternId}/members/${oren.id}`)
      .set('x-csrf-token', admin.csrfToken)
      .send({ role: 'subsystem_owner' })
      .expect(400);
    expect(response.body.error.details).toEqual([{ path: 'body.subsystems', message: 'a subsystem owner needs at least one subsystem' }]);
  });

  it('keeps the last chief engineer', async () => {
    const tomas = await User.findOne({ where: { email: 'tomas.reyes@corvid-sailworks.example' }, rejectOnEmpty: true });
    const demote = await admin.agent
      .put(`/api/crafts/${ternId}/members/${tomas.id}`)
      .set('x-csrf-token', admin.csrfToken)
      .send({ role: 'viewer' })
      .expect(409);
    expect(demote.body.error.code).toBe('last_chief_engineer');
    const remove = await admin.agent.delete(`/api/crafts/${ternId}/members/${tomas.id}`).set('x-csrf-token', admin.csrfToken).expect(409);
    expect(remove.body.error.code).toBe('last_chief_engineer');
  });

  it('gives a subsystem owner their subsystems', async () => {
    const oren = await User.findOne({ where: { email: 'oren.vasquez@corvid-sailworks.example' }, rejectOnEmpty: true });
    const response = await admin.agent
      .put(`/api/crafts/${ternId}/members/${oren.id}`)
      .set('x-csrf-token', admin.csrfToken)
      .send({ role: 'subsystem_owner', subsystems: ['Spacecraft'] })
      .expect(200);
    expect(response.body).toEqual(expect.objectContaining({ role: 'subsystem_owner', subsystems: ['Spacecraft'] }));
  });

  it('refuses a subsystem the craft does not have, naming it', async () => {
    const oren = await User.findOne({ where: { email: 'oren.vasquez@corvid-sailworks.example' }, rejectOnEmpty: true });
    const response = await admin.agent
      .put(`/api/crafts/${ternId}/members/${oren.id}`)
      .set('x-csrf-token', admin.csrfToken)
      .send({ role: 'subsystem_owner', subsystems: ['Spacecraft', 'Bus'] })
      .expect(400);
    expect(response.body.error.details).toEqual([{ path: 'body.subsystems.1', message: 'the craft has no subsystem "Bus"' }]);
  });

  it('keeps an owner on a renamed subsystem', async () => {
    const kenji = await User.findOne({ where: { email: 'kenji.hollis@corvid-sailworks.example' }, rejectOnEmpty: true });
    const amara = await signIn(testApp.app, 'demo-amara', 'sso');
    const tern = await admin.agent.get(`/api/crafts/${ternId}`).expect(200);
    const detail = await admin.agent.get(`/api/crafts/${ternId}/revisions/${tern.body.draftRevisionId}`).expect(200);
    const booms = detail.body.subsystems.find((subsystem: { name: string }) => subsystem.name === 'Booms');
    await amara.agent
      .patch(`/api/crafts/${ternId}/subsystems/${booms.id}`)
      .set('x-csrf-token', amara.csrfToken)
      .send({ name: 'Boom assembly' })
      .expect(200);
    const members = await admin.agent.get(`/api/crafts/${ternId}/members`).expect(200);
    const owner = members.body.members.find((member: { userId: string }) => member.userId === kenji.id);
    expect(owner.subsystems).toEqual(['Boom assembly', 'Deployer']);
  });
});
