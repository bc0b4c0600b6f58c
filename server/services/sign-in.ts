import { Op, UniqueConstraintError, col, fn, where, type Transaction } from 'sequelize';
import { Identity, Invitation, User } from '../models';

export type SignInProvider = 'google' | 'sso';

/** What an identity provider vouched for about the person signing in. */
export interface SignInClaims {
  provider: SignInProvider;
  subject: string;
  email: string;
  name: string;
  emailVerified: boolean;
}

const sameEmail = (email: string) => where(fn('lower', col('email')), email.trim().toLowerCase());

async function linkIdentity(user: User, { provider, subject }: SignInClaims, transaction: Transaction) {
  await Identity.create({ userId: user.id, provider, subject }, { transaction });
  return user;
}

async function resolveUser(claims: SignInClaims): Promise<User | null> {
  const linked = await User.findOne({
    include: [{ association: 'identities', where: { provider: claims.provider, subject: claims.subject }, required: true }],
  });
  if (linked) return linked;
  // Linking by e-mail trusts the provider's word that this person owns the address.
  if (!claims.emailVerified) return null;

  const sequelize = Identity.sequelize;
  if (!sequelize) throw new Error('findUserForSignIn: the models are not initialised on a connection');
  return sequelize.transaction(async (transaction) => {
    const existing = await User.findOne({ where: sameEmail(claims.email), transaction });
    if (existing) return linkIdentity(existing, claims, transaction);

    const invitation = await Invitation.findOne({
      where: { [Op.and]: [sameEmail(claims.email), { acceptedAt: null }] },
      order: [['createdAt', 'DESC']],
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    if (!invitation) return null;
    const user = await User.create(
      { organisationId: invitation.organisationId, email: claims.email.trim().toLowerCase(), name: claims.name || invitation.name },
      { transaction },
    );
    await invitation.update({ acceptedAt: new Date() }, { transaction });
    return linkIdentity(user, claims, transaction);
  });
}

/**
 * Finds the Trimsheet person a provider's sign-in belongs to: by the linked identity (provider, subject);
 * else by a verified e-mail of an existing person, linking the identity; else by a pending invitation for
 * that verified e-mail, creating the person in the invitation's organisation and accepting it (one
 * transaction). Returns null when the sign-in belongs to nobody.
 */
export async function findUserForSignIn(claims: SignInClaims): Promise<User | null> {
  try {
    return await resolveUser(claims);
  } catch (error) {
    // Two first sign-ins of one person at the same moment: the loser finds what the winner linked.
    if (error instanceof UniqueConstraintError) return resolveUser(claims);
    throw error;
  }
}
