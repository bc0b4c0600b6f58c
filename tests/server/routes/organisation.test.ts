import { signIn } from '../helpers/sign-in';
import { createTestApp, testStack, type TestApp } from '../helpers/test-app';

let testApp: TestApp;
let admin: Awaited<ReturnType<typeof signIn>>;

beforeAll(async () => {
  testApp = await createTestApp();
  admin = await signIn(testApp.app, 'demo-ines', 'sso');
});

afterAll(async () => {
  await testApp.close();
});

async function inbox(): Promise<{ to: string[]; subject: string; text: string }[]> {
  const response = await fetch(`${testStack.TEST_MAIL_INBOX_URL}/messages`);
  return ((await response.json()) as { messages: { to: string[]; subject: string; text: string }[] }).messages;
}

describe('POST /api/organisation/invitations', () => {
  it('records the invitation and e-mails it through SMTP', async () => {
    const email = `nadia.${Date.now()}@corvid-sailworks.example`;
    const response = await admin.agent
      .post('/api/organisation/invitations')
      .set('x-csrf-token', admin.csrfToken)
      .send({ name: 'Nadia Frost', email: ` ${email.toUpperCase()} ` })
      .expect(201);
    expect(response.body).toEqual(expect.objectContaining({ email, name: 'Nadia Frost', invitedBy: 'Ines Marlowe', acceptedAt: null }));
    const mail = (await inbox()).find((message) => message.to.includes(email));
    expect(mail?.subject).toBe('Ines Marlowe invited you to Corvid Sailworks on Trimsheet');
    expect(mail?.text).toContain('/sign-in');
  });

  it('lets the invited person sign in and join the organisation', async () => {
    const email = `rafael.${Date.now()}@outside.example`;
    await admin.agent
      .post('/api/organisation/invitations')
      .set('x-csrf-token', admin.csrfToken)
      .send({ name: 'Rafael Quint', email })
      .expect(201);
    const invited = await signIn(testApp.app, { name: 'Rafael Quint', email }, 'google');
    const session = await invited.agent.get('/api/auth/session').expect(200);
    expect(session.body.user).toEqual(
      expect.objectContaining({ email, name: 'Rafael Quint', organisation: expect.objectContaining({ name: 'Corvid Sailworks' }) }),
    );
    const organisation = await admin.agent.get('/api/organisation').expect(200);
    expect(organisation.body.invitations.find((i: { email: string }) => i.email === email).acceptedAt).toEqual(expect.any(String));
  });

  it('says which field is wrong', async () => {
    const response = await admin.agent
      .post('/api/organisation/invitations')
      .set('x-csrf-token', admin.csrfToken)
      .send({ name: '', email: 'nope' })
      .expect(400);
    expect(response.body.error.details).toEqual(
      expect.arrayContaining([
        { path: 'body.email', message: 'must be an e-mail address' },
        { path: 'body.name', message: 'must not be empty' },
      ]),
    );
  });

  it('treats a person of another organisation like anyone else, so accounts elsewhere cannot be probed', async () => {
    const response = await admin.agent
      .post('/api/organisation/invitations')
      .set('x-csrf-token', admin.csrfToken)
      .send({ name: 'Priya Lund', email: 'priya.lund@pelagic-orbital.example' })
      .expect(201);
    expect(response.body.acceptedAt).toBeNull();
  });

  it('refuses someone who is already in the organisation', async () => {
    const response = await admin.agent
      .post('/api/organisation/invitations')
      .set('x-csrf-token', admin.csrfToken)
      .send({ name: 'Tomás Reyes', email: 'tomas.reyes@corvid-sailworks.example' })
      .expect(409);
    expect(response.body.error.code).toBe('already_a_person');
  });
});

describe('GET /api/organisation', () => {
  it('lists the people and the invitations for an admin', async () => {
    const response = await admin.agent.get('/api/organisation').expect(200);
    expect(response.body.organisation.name).toBe('Corvid Sailworks');
    expect(response.body.people.map((p: { name: string }) => p.name)).toContain('Kenji Hollis');
  });
});

describe('PUT /api/organisation/people/:userId/admin', () => {
  it('keeps the last admin', async () => {
    const people = (await admin.agent.get('/api/organisation').expect(200)).body.people as { id: string; name: string }[];
    const ines = people.find((p) => p.name === 'Ines Marlowe');
    const response = await admin.agent
      .put(`/api/organisation/people/${ines?.id}/admin`)
      .set('x-csrf-token', admin.csrfToken)
      .send({ isOrgAdmin: false })
      .expect(409);
    expect(response.body.error.code).toBe('last_admin');
  });
});
