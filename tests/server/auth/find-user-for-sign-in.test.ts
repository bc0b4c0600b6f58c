import { Identity, Invitation, Organisation, User } from '@/server/models';
import { demoOrganisations, demoPeople } from '@/server/seed/demo-scenario';
import { findUserForSignIn } from '@/server/services/sign-in';
import { createTestApp, type TestApp } from '../helpers/test-app';

let testApp: TestApp;
const tomas = demoPeople.find((person) => person.subject === 'demo-tomas');

beforeAll(async () => {
  testApp = await createTestApp();
});

afterAll(async () => {
  await testApp.close();
});

describe('findUserForSignIn', () => {
  it('does not link by an e-mail the provider has not verified', async () => {
    if (!tomas) throw new Error('demo-tomas is missing from the demo people');
    const claims = { provider: 'google' as const, subject: 'g-unverified', email: tomas.email, name: tomas.name, emailVerified: false };
    expect(await findUserForSignIn(claims)).toBeNull();
    expect(await Identity.count({ where: { subject: 'g-unverified' } })).toBe(0);
  });

  it('matches e-mail addresses without regard to case and surrounding space', async () => {
    if (!tomas) throw new Error('demo-tomas is missing from the demo people');
    const user = await findUserForSignIn({ provider: 'google', subject: 'g-tomas', email: ` ${tomas.email.toUpperCase()} `, name: '', emailVerified: true });
    expect(user?.email).toBe(tomas.email);
    expect(await Identity.count({ where: { subject: 'g-tomas', userId: user?.id } })).toBe(1);
  });

  it('finds the person by a linked identity even when the e-mail has changed at the provider', async () => {
    const user = await findUserForSignIn({ provider: 'google', subject: 'g-tomas', email: 'tomas@elsewhere.example', name: '', emailVerified: false });
    expect(user?.email).toBe(tomas?.email);
  });

  it('does not accept an invitation twice', async () => {
    const pelagic = await Organisation.findOne({ where: { slug: demoOrganisations.pelagic.slug }, rejectOnEmpty: true });
    const inviter = await User.findOne({ where: { organisationId: pelagic.id }, rejectOnEmpty: true });
    const email = 'wren.ashby@pelagic-orbital.example';
    await Invitation.create({ organisationId: pelagic.id, invitedById: inviter.id, email, name: 'Wren Ashby' });
    const first = await findUserForSignIn({ provider: 'sso', subject: 'sso-wren', email, name: 'Wren Ashby', emailVerified: true });
    expect(first).toEqual(expect.objectContaining({ email, name: 'Wren Ashby', organisationId: pelagic.id }));
    const other = await findUserForSignIn({ provider: 'google', subject: 'g-wren', email, name: 'Wren Ashby', emailVerified: true });
    expect(other?.id).toBe(first?.id);
    expect(await User.count({ where: { email } })).toBe(1);
  });

  it('returns null for an e-mail nobody has and nobody invited', async () => {
    expect(await findUserForSignIn({ provider: 'sso', subject: 'sso-stranger', email: 'stranger@example.org', name: 'Stranger', emailVerified: true })).toBeNull();
  });
});
