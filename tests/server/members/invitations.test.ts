import request from 'supertest';
import { Identity, Invitation, User } from '@/server/models';
import { invitationMail, quotedForMail } from '@/server/services/organisation';
import { inviteBodySchema } from '@/shared/schemas/organisation';
import { type Agent, chooseAtFake, CookieJar, demoPerson, type FakeChoice, locationOf, type Provider, signIn } from '../helpers/sign-in';
import { createTestApp, testStack, type TestApp } from '../helpers/test-app';

let testApp: TestApp;
let ines: Awaited<ReturnType<typeof signIn>>;
let priya: Awaited<ReturnType<typeof signIn>>;

beforeAll(async () => {
  testApp = await createTestApp();
  ines = await signIn(testApp.app, 'demo-ines', 'sso');
  priya = await signIn(testApp.app, 'demo-priya', 'sso');
});

afterAll(async () => {
  await testApp.close();
});

type Admin = typeof ines;
const invite = (admin: Admin, body: object) =>
  admin.agent.post('/api/organisation/invitations').set('x-csrf-token', admin.csrfToken).send(body);
const withdraw = (admin: Admin, invitationId: string) =>
  admin.agent.delete(`/api/organisation/invitations/${invitationId}`).set('x-csrf-token', admin.csrfToken);

/** Starts a sign-in at `startPath` in the agent's browser, chooses at the fake, and returns where the app's callback lands. */
async function signInFrom(agent: Agent, startPath: string, choice: FakeChoice, provider: Provider): Promise<string> {
  const authorizationUrl = locationOf(await agent.get(startPath).expect(302));
  const callback = await chooseAtFake(new CookieJar(), authorizationUrl, choice, `/api/auth/${provider}/callback`);
  return locationOf(await agent.get(`${callback.pathname}${callback.search}`).expect(302));
}

async function inbox(): Promise<{ to: string[]; subject: string; text: string }[]> {
  const response = await fetch(`${testStack.TEST_MAIL_INBOX_URL}/messages`);
  return ((await response.json()) as { messages: { to: string[]; subject: string; text: string }[] }).messages;
}

describe('an invitation naming a provider, for someone already in the organisation', () => {
  const tomas = demoPerson('demo-tomas');
  const claim = { name: 'Tomás on Google', email: tomas.email };

  it("is not accepted from another organisation: that person's new sign-in is refused", async () => {
    await invite(priya, { name: 'Tomás Reyes', email: tomas.email, provider: 'google' }).expect(201);
    const browser = request.agent(testApp.app);
    expect(await signInFrom(browser, '/api/auth/google', claim, 'google')).toBe('/sign-in?error=identity_not_linked');
  });

  it('is refused without a provider (they are already in), and for a provider they already have', async () => {
    expect((await invite(ines, { name: 'Tomás Reyes', email: tomas.email }).expect(409)).body.error.code).toBe('already_a_person');
    expect((await invite(ines, { name: 'Tomás Reyes', email: tomas.email, provider: 'sso' }).expect(409)).body.error.code).toBe(
      'already_linked',
    );
  });

  it("links that provider's sign-in to the person when accepted, and only once", async () => {
    await Identity.destroy({ where: { provider: 'google', subject: 'demo-tomas' } });
    const sent = await invite(ines, { name: 'Tomás Reyes', email: tomas.email, provider: 'google' }).expect(201);
    expect(sent.body.provider).toBe('google');
    const browser = request.agent(testApp.app);
    expect(await signInFrom(browser, '/api/auth/google', claim, 'google')).toBe('/crafts');
    expect((await browser.get('/api/auth/session').expect(200)).body.user).toEqual(
      expect.objectContaining({ email: tomas.email, name: tomas.name }),
    );
    expect((await Invitation.findByPk(sent.body.id as string, { rejectOnEmpty: true })).acceptedAt).toBeInstanceOf(Date);
    const other = request.agent(testApp.app);
    expect(await signInFrom(other, '/api/auth/google', { name: 'Someone', email: tomas.email }, 'google')).toBe(
      '/sign-in?error=identity_not_linked',
    );
  });
});

describe('competing invitations of two organisations', () => {
  const email = 'kit.rowe@outside.example';
  const kit = { name: 'Kit Rowe', email };

  it('are offered to the invitee to choose, and the chosen one is accepted', async () => {
    const corvid = (await invite(ines, { name: 'Kit Rowe', email }).expect(201)).body as { id: string };
    const pelagic = (await invite(priya, { name: 'Kit Rowe', email }).expect(201)).body as { id: string };
    const browser = request.agent(testApp.app);
    expect(await signInFrom(browser, '/api/auth/google', kit, 'google')).toBe('/sign-in?error=choose_invitation');
    expect(await User.count({ where: { email } })).toBe(0);

    const choice = (await browser.get('/api/auth/session').expect(200)).body.invitationChoice;
    expect(choice.email).toBe(email);
    expect(choice.invitations).toEqual(
      expect.arrayContaining([
        {
          id: corvid.id,
          organisation: 'Corvid Sailworks',
          invitedBy: 'Ines Marlowe',
          startUrl: `/api/auth/google?invitation=${corvid.id}`,
        },
        { id: pelagic.id, organisation: 'Pelagic Orbital', invitedBy: 'Priya Lund', startUrl: `/api/auth/google?invitation=${pelagic.id}` },
      ]),
    );
    // A browser that was not offered the choice cannot make it.
    expect((await request(testApp.app).get('/api/auth/session').expect(200)).body.invitationChoice).toBeNull();

    expect(await signInFrom(browser, `/api/auth/google?invitation=${pelagic.id}`, kit, 'google')).toBe('/crafts');
    const session = (await browser.get('/api/auth/session').expect(200)).body;
    expect(session.user.organisation.name).toBe('Pelagic Orbital');
    expect(session.invitationChoice).toBeNull();
    expect((await Invitation.findByPk(pelagic.id, { rejectOnEmpty: true })).acceptedAt).toBeInstanceOf(Date);
    expect((await Invitation.findByPk(corvid.id, { rejectOnEmpty: true })).acceptedAt).toBeNull();
  });

  it('refuse a chosen invitation that was withdrawn meanwhile with invitation_unavailable', async () => {
    const address = 'lee.hart@outside.example';
    const lee = { name: 'Lee Hart', email: address };
    await invite(ines, { name: 'Lee Hart', email: address }).expect(201);
    const pelagic = (await invite(priya, { name: 'Lee Hart', email: address }).expect(201)).body as { id: string };
    const browser = request.agent(testApp.app);
    expect(await signInFrom(browser, '/api/auth/sso', lee, 'sso')).toBe('/sign-in?error=choose_invitation');
    await withdraw(priya, pelagic.id).expect(204);
    expect(await signInFrom(browser, `/api/auth/sso?invitation=${pelagic.id}`, lee, 'sso')).toBe('/sign-in?error=invitation_unavailable');
    expect(await User.count({ where: { email: address } })).toBe(0);
  });
});

describe('DELETE /api/organisation/invitations/:invitationId', () => {
  it('withdraws the invitation, which can then no longer be accepted', async () => {
    const email = 'wes.park@outside.example';
    const sent = (await invite(ines, { name: 'Wes Park', email }).expect(201)).body as { id: string };
    await withdraw(ines, sent.id).expect(204);
    await withdraw(ines, sent.id).expect(204);
    const listed = (await ines.agent.get('/api/organisation').expect(200)).body.invitations.find((i: { id: string }) => i.id === sent.id);
    expect(listed).toEqual(expect.objectContaining({ withdrawnAt: expect.any(String), acceptedAt: null }));
    const browser = request.agent(testApp.app);
    expect(await signInFrom(browser, '/api/auth/google', { name: 'Wes Park', email }, 'google')).toBe('/sign-in?error=no_account');
    expect(await User.count({ where: { email } })).toBe(0);
  });

  it('refuses an accepted invitation with 409, another organisation with 404, and non-admins with 403', async () => {
    const email = 'ada.finch@outside.example';
    const sent = (await invite(ines, { name: 'Ada Finch', email }).expect(201)).body as { id: string };
    await withdraw(priya, sent.id).expect(404);
    const tomas = await signIn(testApp.app, 'demo-tomas', 'sso');
    await withdraw(tomas, sent.id).expect(403);
    await signIn(testApp.app, { name: 'Ada Finch', email }, 'google');
    expect((await withdraw(ines, sent.id).expect(409)).body.error.code).toBe('invitation_accepted');
    await withdraw(ines, 'not-a-uuid').expect(400);
  });
});

describe('POST /api/organisation/invitations: lengths and the mail', () => {
  const address = (domainTail: number) => `${'a'.repeat(64)}@${['b'.repeat(63), 'c'.repeat(63), 'd'.repeat(domainTail)].join('.')}.example`;

  it('refuses an address over 254 characters, or a name over 120, with 400 naming the field, and saves nothing', async () => {
    expect(address(54)).toHaveLength(255);
    const long = await invite(ines, { name: 'Long Address', email: address(54) }).expect(400);
    expect(long.body.error.details).toEqual([{ path: 'body.email', message: 'must be at most 254 characters' }]);
    const huge = await invite(ines, { name: 'Huge Address', email: `${'x'.repeat(5000)}@example.org` }).expect(400);
    expect(huge.body.error.details).toEqual([{ path: 'body.email', message: 'must be at most 254 characters' }]);
    const name = await invite(ines, { name: 'N'.repeat(121), email: 'long.name@example.org' }).expect(400);
    expect(name.body.error.details).toEqual([{ path: 'body.name', message: 'must be at most 120 characters' }]);
    expect(await Invitation.count({ where: { name: ['Long Address', 'Huge Address'] } })).toBe(0);
  });

  it('takes an address of exactly 254 characters as valid, and sends to one of 253', async () => {
    expect(address(53)).toHaveLength(254);
    expect(inviteBodySchema.safeParse({ name: 'Edge Case', email: address(53) }).success).toBe(true);
    // The development mail server refuses 254 (it counts the path's "@" among its 256 octets); 253 goes through.
    expect(address(52)).toHaveLength(253);
    await invite(ines, { name: 'Edge Case', email: address(52) }).expect(201);
  });

  it('refuses line breaks in the name with 400, so no header or line can be added to the mail', async () => {
    const response = await invite(ines, { name: 'Eve\r\nBcc: victim@example.org', email: 'eve@example.org' }).expect(400);
    expect(response.body.error.details).toEqual([expect.objectContaining({ path: 'body.name' })]);
    expect((await inbox()).some((mail) => mail.to.includes('victim@example.org'))).toBe(false);
  });

  it('puts the name in the fixed mail text only in quotes, as data', async () => {
    const email = `quoted.${Date.now()}@example.org`;
    await invite(ines, { name: 'Nadia "Sign in at evil.example" Frost', email }).expect(201);
    const mail = (await inbox()).find((message) => message.to.includes(email));
    expect(mail?.subject).toBe('Ines Marlowe invited you to Corvid Sailworks on Trimsheet');
    const lines = (mail?.text ?? '').trim().split(/\r?\n/);
    expect(lines[0]).toBe('Hello,');
    expect(lines).toContain(`Invitation for: "Nadia \\"Sign in at evil.example\\" Frost" <${email}>`);
    expect(lines).toHaveLength(10);
  });

  it('writes control and format characters of names as escapes', () => {
    expect(quotedForMail('Eve\nBcc: x\u202Eevil')).toBe('"Eve\\u{a}Bcc: x\\u{202e}evil"');
    const admin = { name: 'Admin\r\nBcc: x@example.org' } as User;
    const mail = invitationMail({ email: 'a@example.org', name: 'A' }, admin, { name: 'Org' } as never, 'http://app');
    expect(mail.subject).toBe('Admin Bcc: x@example.org invited you to Org on Trimsheet');
    expect(mail.text).toContain('Invited by: "Admin\\u{d}\\u{a}Bcc: x@example.org"');
  });
});

describe('the directory', () => {
  const lucia = demoPerson('demo-lucia');

  it('shows a partner only the names of the people on their crafts, without e-mails or admin flags', async () => {
    const partner = await signIn(testApp.app, lucia.subject, 'sso');
    const response = await partner.agent.get('/api/organisation').expect(200);
    expect(response.body.directory).toBe('craft_members');
    expect(response.body.invitations).toEqual([]);
    for (const entry of response.body.people as object[]) expect(Object.keys(entry).sort()).toEqual(['id', 'name']);
    const names = (response.body.people as { name: string }[]).map((entry) => entry.name);
    expect(names).toEqual(expect.arrayContaining(['Tomás Reyes', 'Kenji Hollis', lucia.name]));
    // The organisation admin holds no role on Tern: a partner has no need of them.
    expect(names).not.toContain('Ines Marlowe');
    expect(JSON.stringify(response.body)).not.toContain('@');
  });

  it("shows a partner the craft's members without e-mails", async () => {
    const partner = await signIn(testApp.app, lucia.subject, 'sso');
    const craft = ((await partner.agent.get('/api/crafts').expect(200)).body.crafts as { id: string; name: string }[]).find(
      (c) => c.name === 'Tern',
    );
    const members = await partner.agent.get(`/api/crafts/${craft?.id}/members`).expect(200);
    expect(members.body.members.length).toBeGreaterThan(1);
    for (const member of members.body.members as object[]) expect(member).not.toHaveProperty('email');
  });

  it('shows engineers everyone with e-mails and admin flags', async () => {
    const tomas = await signIn(testApp.app, 'demo-tomas', 'sso');
    const response = await tomas.agent.get('/api/organisation').expect(200);
    expect(response.body.directory).toBe('organisation');
    expect(response.body.people).toEqual(
      expect.arrayContaining([expect.objectContaining({ name: 'Ines Marlowe', email: demoPerson('demo-ines').email, isOrgAdmin: true })]),
    );
  });
});
