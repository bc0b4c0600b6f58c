import { invitationLimits } from '@/server/services/organisation';
import { signIn } from '../helpers/sign-in';
import { createTestApp, type TestApp } from '../helpers/test-app';

let testApp: TestApp;

beforeAll(async () => {
  testApp = await createTestApp();
});

afterAll(async () => {
  await testApp.close();
});

const invite = (admin: Awaited<ReturnType<typeof signIn>>, index: number) =>
  admin.agent
    .post('/api/organisation/invitations')
    .set('x-csrf-token', admin.csrfToken)
    .send({ name: `Invitee ${index}`, email: `invitee.${index}@outside.example` });

describe('POST /api/organisation/invitations rate limits', () => {
  it('refuses an admin past their hourly limit with 429 rate_limited, counted in PostgreSQL', async () => {
    const priya = await signIn(testApp.app, 'demo-priya', 'sso');
    for (let index = 0; index < invitationLimits.perAdmin.limit; index += 1) await invite(priya, index).expect(201);
    const refused = await invite(priya, invitationLimits.perAdmin.limit).expect(429);
    expect(refused.body.error).toEqual(
      expect.objectContaining({ code: 'rate_limited', message: expect.stringContaining('invitations from you') }),
    );
    const [rows] = await testApp.sequelize.query(`SELECT hits FROM rate_limits WHERE bucket = 'invitations_per_admin'`);
    expect(rows).toEqual([{ hits: invitationLimits.perAdmin.limit + 1 }]);
  }, 60_000);

  it("refuses every admin of an organisation past the organisation's hourly limit", async () => {
    const ines = await signIn(testApp.app, 'demo-ines', 'sso');
    const session = await ines.agent.get('/api/auth/session').expect(200);
    // The organisation's other admins have sent their share already.
    await testApp.sequelize.query(
      `INSERT INTO rate_limits (bucket, key, hits, window_ends_at) VALUES ('invitations_per_organisation', $1, $2, now() + interval '1 hour')`,
      { bind: [session.body.user.organisation.id, invitationLimits.perOrganisation.limit] },
    );
    const refused = await invite(ines, 1000).expect(429);
    expect(refused.body.error.message).toContain('invitations from your organisation');
  });
});
