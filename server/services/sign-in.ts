import { Op, UniqueConstraintError, col, fn, where, type Transaction } from 'sequelize';
import { textLine } from '@/shared/schemas/common';
import type { IdentityLinkResult, SignInErrorCode, SignInProvider } from '@/shared/schemas/session';
import { Identity, Invitation, Organisation, User } from '../models';

/** What an identity provider vouched for about the person signing in. */
export interface SignInClaims {
  provider: SignInProvider;
  subject: string;
  email: string;
  name: string;
  emailVerified: boolean;
}

/** One organisation's invitation the invitee may choose when several organisations invited the address. */
export interface InvitationOption {
  id: string;
  organisation: string;
  invitedBy: string;
}

/** Where a sign-in leads: to a person, to a refusal with its reason, or to a choice between invitations. */
export type SignInOutcome =
  | { kind: 'person'; user: User }
  | { kind: 'refused'; code: SignInErrorCode }
  | { kind: 'choose'; email: string; invitations: InvitationOption[] };

const normalisedEmail = (email: string) => email.trim().toLowerCase();
const sameEmail = (email: string) => where(fn('lower', col('email')), normalisedEmail(email));
const refused = (code: SignInErrorCode): SignInOutcome => ({ kind: 'refused', code });
const personName = textLine(120);

function connection() {
  const sequelize = Identity.sequelize;
  if (!sequelize) throw new Error('sign-in: the models are not initialised on a connection');
  return sequelize;
}

/** The person the provider's identity (provider, subject) is linked to, if any. */
function linkedPerson({ provider, subject }: Pick<SignInClaims, 'provider' | 'subject'>) {
  return User.findOne({ include: [{ association: 'identities', where: { provider, subject }, required: true }] });
}

/** The address's invitations not yet accepted nor withdrawn, newest first, locked against a withdrawal at the same moment. */
function pendingInvitations(email: string, transaction: Transaction) {
  return Invitation.findAll({
    where: { [Op.and]: [sameEmail(email), { acceptedAt: null, withdrawnAt: null }] },
    order: [['createdAt', 'DESC']],
    transaction,
    lock: transaction.LOCK.UPDATE,
  });
}

/** The newest invitation of each organisation, named for the invitee to choose from. */
async function optionsOf(invitations: readonly Invitation[], transaction: Transaction): Promise<InvitationOption[]> {
  const newest = invitations.filter(
    (invitation, index) => invitations.findIndex((i) => i.organisationId === invitation.organisationId) === index,
  );
  const organisations = await Organisation.findAll({ where: { id: newest.map((i) => i.organisationId) }, transaction });
  const inviters = await User.findAll({ where: { id: newest.map((i) => i.invitedById) }, transaction });
  return newest.map((invitation) => ({
    id: invitation.id,
    organisation: organisations.find((o) => o.id === invitation.organisationId)?.name ?? '',
    invitedBy: inviters.find((u) => u.id === invitation.invitedById)?.name ?? '',
  }));
}

async function accept(invitation: Invitation, user: User, claims: SignInClaims, transaction: Transaction): Promise<SignInOutcome> {
  await invitation.update({ acceptedAt: new Date() }, { transaction });
  await Identity.create({ userId: user.id, provider: claims.provider, subject: claims.subject }, { transaction });
  return { kind: 'person', user };
}

/**
 * A verified address without a linked identity: an invitation decides. For a person who already has the
 * address, only an invitation of their own organisation naming this provider links it; the provider's word
 * that the address is verified is never enough. Otherwise a new person joins the organisation that invited
 * them; when several organisations did, the invitee chooses (`invitationId`).
 */
async function signInByInvitation(
  claims: SignInClaims,
  invitationId: string | undefined,
  transaction: Transaction,
): Promise<SignInOutcome> {
  const existing = await User.findOne({ where: sameEmail(claims.email), transaction });
  const pending = await pendingInvitations(claims.email, transaction);
  if (existing) {
    const link = pending.find((i) => i.organisationId === existing.organisationId && i.provider === claims.provider);
    return link ? accept(link, existing, claims, transaction) : refused('identity_not_linked');
  }
  const usable = pending.filter((invitation) => invitation.provider === null || invitation.provider === claims.provider);
  if (usable.length === 0) return refused(pending.length > 0 ? 'other_provider' : 'no_account');
  const chosen = invitationId === undefined ? usable[0] : usable.find((invitation) => invitation.id === invitationId);
  if (!chosen) return refused('invitation_unavailable');
  if (invitationId === undefined && usable.some((invitation) => invitation.organisationId !== chosen.organisationId)) {
    return { kind: 'choose', email: normalisedEmail(claims.email), invitations: await optionsOf(usable, transaction) };
  }
  const name = personName.safeParse(claims.name);
  const user = await User.create(
    { organisationId: chosen.organisationId, email: normalisedEmail(claims.email), name: name.success ? name.data : chosen.name },
    { transaction },
  );
  return accept(chosen, user, claims, transaction);
}

async function resolveSignIn(claims: SignInClaims, invitationId: string | undefined): Promise<SignInOutcome> {
  const linked = await linkedPerson(claims);
  if (linked) return { kind: 'person', user: linked };
  if (!claims.emailVerified) return refused('email_not_verified');
  return connection().transaction((transaction) => signInByInvitation(claims, invitationId, transaction));
}

/**
 * Finds whom a provider's sign-in belongs to: the person its identity (provider, subject) is linked to;
 * else, for a verified address, through a pending invitation (creating the person, or linking the identity
 * to the person of the inviting organisation who has the address, when the invitation names this provider),
 * accepted in the same transaction. `invitationId` is the invitee's choice among several organisations'.
 */
export async function findUserForSignIn(claims: SignInClaims, invitationId?: string): Promise<SignInOutcome> {
  try {
    return await resolveSignIn(claims, invitationId);
  } catch (error) {
    // Two first sign-ins of one person at the same moment: the loser finds what the winner linked.
    if (error instanceof UniqueConstraintError) return resolveSignIn(claims, invitationId);
    throw error;
  }
}

/**
 * Links a provider's identity to the signed-in person, who asked for it from their account: the deliberate
 * step that lets one person sign in more than one way. An identity linked to someone else stays theirs.
 */
export async function linkIdentityToPerson(user: User, claims: Pick<SignInClaims, 'provider' | 'subject'>): Promise<IdentityLinkResult> {
  const { provider, subject } = claims;
  const existing = await Identity.findOne({ where: { provider, subject } });
  if (existing) return existing.userId === user.id ? 'already_linked' : 'identity_in_use';
  try {
    await Identity.create({ userId: user.id, provider, subject });
    return 'linked';
  } catch (error) {
    if (error instanceof UniqueConstraintError) return linkIdentityToPerson(user, claims);
    throw error;
  }
}

/** The person's linked sign-ins, oldest first. */
export async function listIdentities(user: User): Promise<{ provider: SignInProvider; linkedAt: string }[]> {
  const identities = await Identity.findAll({ where: { userId: user.id }, order: [['createdAt', 'ASC']] });
  return identities.map((identity) => ({ provider: identity.provider, linkedAt: identity.createdAt.toISOString() }));
}
