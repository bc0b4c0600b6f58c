import { Identity, Invitation, Organisation, User } from '@/server/models';
import { demoOrganisations, demoPeople } from '@/server/seed/demo-scenario';
import { findUserForSignIn, type SignInClaims, type SignInOutcome } from '@/server/services/sign-in';
import { createTestApp, type TestApp } from '../helpers/test-app';

let testApp: TestApp;
const tomas = demoPeople.find((person) => person.subject === 'demo-tomas');

beforeAll(async () => {
  testApp = await createTestApp();
});

afterAll(async () => {
  await testApp.close();
});

/** The person an outcome signs in, or fails the test naming what it was instead. */
function personOf(outcome: SignInOutcome): User {
  if (outcome.kind !== 'person') throw new Error(`expected a person, got ${JSON.stringify(outcome)}`);
  return outcome.user;
}

async function pelagicInviter() {
  const pelagic = await Organisation.findOne({ where: { slug: demoOrganisations.pelagic.slug }, rejectOnEmpty: true });
  return { pelagic, inviter: await User.findOne({ where: { organisationId: pelagic.id }, rejectOnEmpty: true }) };
}

describe('findUserForSignIn', () => {
  it('refuses an unverified address with email_not_verified, and links nothing', async () => {
    if (!tomas) throw new Error('demo-tomas is missing from the demo people');
    const claims = { provider: 'google' as const, subject: 'g-unverified', email: tomas.email, name: tomas.name, emailVerified: false };
    expect(await findUserForSignIn(claims)).toEqual({ kind: 'refused', code: 'email_not_verified' });
    expect(await Identity.count({ where: { subject: 'g-unverified' } })).toBe(0);
  });

  it('never links a new identity to a person by a verified address alone, whatever its case and spacing', async () => {
    if (!tomas) throw new Error('demo-tomas is missing from the demo people');
    const claims: SignInClaims = {
      provider: 'google',
      subject: 'g-tomas',
      email: ` ${tomas.email.toUpperCase()} `,
      name: '',
      emailVerified: true,
    };
    expect(await findUserForSignIn(claims)).toEqual({ kind: 'refused', code: 'identity_not_linked' });
    expect(await Identity.count({ where: { subject: 'g-tomas' } })).toBe(0);
  });

  it('finds the person by a linked identity even when the e-mail has changed at the provider', async () => {
    const user = personOf(
      await findUserForSignIn({ provider: 'sso', subject: 'demo-tomas', email: 'tomas@elsewhere.example', name: '', emailVerified: false }),
    );
    expect(user.email).toBe(tomas?.email);
  });

  it('does not accept an invitation twice', async () => {
    const { pelagic, inviter } = await pelagicInviter();
    const email = 'wren.ashby@pelagic-orbital.example';
    await Invitation.create({ organisationId: pelagic.id, invitedById: inviter.id, email, name: 'Wren Ashby' });
    const first = personOf(
      await findUserForSignIn({ provider: 'sso', subject: 'sso-wren', email, name: 'Wren Ashby', emailVerified: true }),
    );
    expect(first).toEqual(expect.objectContaining({ email, name: 'Wren Ashby', organisationId: pelagic.id }));
    // The accepted invitation does not let a second provider's identity in.
    expect(await findUserForSignIn({ provider: 'google', subject: 'g-wren', email, name: 'Wren Ashby', emailVerified: true })).toEqual({
      kind: 'refused',
      code: 'identity_not_linked',
    });
    expect(await User.count({ where: { email } })).toBe(1);
  });

  it('takes the name from the invitation when the provider gives none usable', async () => {
    const { pelagic, inviter } = await pelagicInviter();
    const email = 'ida.moss@pelagic-orbital.example';
    await Invitation.create({ organisationId: pelagic.id, invitedById: inviter.id, email, name: 'Ida Moss' });
    const user = personOf(await findUserForSignIn({ provider: 'sso', subject: 'sso-ida', email, name: 'Ida\nMoss', emailVerified: true }));
    expect(user.name).toBe('Ida Moss');
  });

  it('refuses an invitation for the other provider with other_provider', async () => {
    const { pelagic, inviter } = await pelagicInviter();
    const email = 'noor.vale@pelagic-orbital.example';
    await Invitation.create({ organisationId: pelagic.id, invitedById: inviter.id, email, name: 'Noor Vale', provider: 'sso' });
    expect(await findUserForSignIn({ provider: 'google', subject: 'g-noor', email, name: 'Noor Vale', emailVerified: true })).toEqual({
      kind: 'refused',
      code: 'other_provider',
    });
    expect(
      personOf(await findUserForSignIn({ provider: 'sso', subject: 'sso-noor', email, name: 'Noor Vale', emailVerified: true })).email,
    ).toBe(email);
  });

  it('returns no_account for an e-mail nobody has and nobody invited', async () => {
    expect(
      await findUserForSignIn({
        provider: 'sso',
        subject: 'sso-stranger',
        email: 'stranger@example.org',
        name: 'Stranger',
        emailVerified: true,
      }),
    ).toEqual({
      kind: 'refused',
      code: 'no_account',
    });
  });
});
