import request from 'supertest';
import { Identity, Invitation, Organisation, User } from '@/server/models';
import { demoOrganisations } from '@/server/seed/demo-scenario';
import { callbackFromFake, demoPerson, locationOf, signIn } from '../helpers/sign-in';
import { createTestApp, type TestApp } from '../helpers/test-app';

let testApp: TestApp;

beforeAll(async () => {
  testApp = await createTestApp();
});

afterAll(async () => {
  await testApp.close();
});

async function finishAt(subject: string, provider: 'google' | 'sso') {
  const agent = request.agent(testApp.app);
  const callback = await callbackFromFake(agent, subject, provider);
  return { agent, location: locationOf(await agent.get(callback).expect(302)) };
}

describe('signing in again', () => {
  it('finds the person by their linked identity and links nothing new', async () => {
    const amara = demoPerson('demo-amara');
    const user = await User.findOne({ where: { email: amara.email }, rejectOnEmpty: true });
    const before = await Identity.count({ where: { userId: user.id } });
    await signIn(testApp.app, amara.subject, 'sso');
    await signIn(testApp.app, amara.subject, 'sso');
    expect(await Identity.count({ where: { userId: user.id } })).toBe(before);
  });
});

describe('a person with no Trimsheet account', () => {
  it('is refused with no_account and nothing is created', async () => {
    const oren = demoPerson('demo-oren');
    await User.destroy({ where: { email: oren.email } });
    const { agent, location } = await finishAt(oren.subject, 'google');
    expect(location).toBe('/sign-in?error=no_account');
    expect(await User.count({ where: { email: oren.email } })).toBe(0);
    expect(await Identity.count({ where: { subject: oren.subject } })).toBe(0);
    const session = await agent.get('/api/auth/session').expect(200);
    expect(session.body.user).toBeNull();
  });
});

describe('a person with a pending invitation', () => {
  it('becomes a member of the inviting organisation at first sign-in, and the invitation is accepted', async () => {
    const lucia = demoPerson('demo-lucia');
    const corvid = await Organisation.findOne({ where: { slug: demoOrganisations.corvid.slug }, rejectOnEmpty: true });
    const inviter = await User.findOne({ where: { email: demoPerson('demo-ines').email }, rejectOnEmpty: true });
    await User.destroy({ where: { email: lucia.email } });
    const invitation = await Invitation.create({
      organisationId: corvid.id,
      invitedById: inviter.id,
      email: lucia.email.toUpperCase(),
      name: 'Lucia B.',
    });

    const { agent } = await signIn(testApp.app, lucia.subject, 'sso');

    const session = await agent.get('/api/auth/session').expect(200);
    expect(session.body.user).toEqual(
      expect.objectContaining({
        email: lucia.email,
        name: lucia.name,
        isOrgAdmin: false,
        organisation: { id: corvid.id, name: corvid.name },
      }),
    );
    await invitation.reload();
    expect(invitation.acceptedAt).toBeInstanceOf(Date);
    const user = await User.findOne({ where: { email: lucia.email }, rejectOnEmpty: true });
    expect(await Identity.count({ where: { userId: user.id, provider: 'sso', subject: lucia.subject } })).toBe(1);
  });
});

describe('a session whose person was removed', () => {
  it('is treated as signed out', async () => {
    // Priya's craft has no baseline: one keeps its rows' last editors, so removing them would be refused.
    const priya = demoPerson('demo-priya');
    const { agent } = await signIn(testApp.app, priya.subject, 'sso');
    await User.destroy({ where: { email: priya.email } });
    const session = await agent.get('/api/auth/session').expect(200);
    expect(session.body.user).toBeNull();
  });
});
