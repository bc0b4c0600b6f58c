import type { Sequelize, Transaction } from 'sequelize';
import type { Member, SetMemberBody } from '@/shared/schemas/members';
import { HttpError, notFound } from '../http-error';
import { Craft, Membership, User } from '../models';
import { authorizeCraft } from './craft-access';

function toMemberDto(membership: Membership, user: User): Member {
  return { userId: user.id, name: user.name, email: user.email, role: membership.role, subsystems: membership.subsystems };
}

/** The craft's members with their roles, by name. */
export async function listMembers(user: User, craftId: string): Promise<Member[]> {
  await authorizeCraft(user, craftId, 'viewMembers');
  const memberships = await Membership.findAll({ where: { craftId }, include: [{ model: User, as: 'user' }] });
  return memberships
    .flatMap((membership) => (membership.user ? [toMemberDto(membership, membership.user)] : []))
    .sort((a, b) => a.name.localeCompare(b.name));
}

/**
 * Runs a change of the craft's memberships with the craft's row locked, so that two changes at the same
 * moment cannot both pass the last-chief-engineer check.
 */
function changeMemberships<T>(sequelize: Sequelize, craftId: string, change: (transaction: Transaction) => Promise<T>): Promise<T> {
  return sequelize.transaction(async (transaction) => {
    await Craft.findByPk(craftId, { lock: transaction.LOCK.UPDATE, transaction });
    return change(transaction);
  });
}

/** Adds a person of the same organisation to the craft, or changes their role. */
export async function setMember(sequelize: Sequelize, user: User, craftId: string, memberId: string, body: SetMemberBody): Promise<Member> {
  const { craft } = await authorizeCraft(user, craftId, 'manageMembers');
  const person = await User.findOne({ where: { id: memberId, organisationId: craft.organisationId } });
  if (!person) throw notFound('Person');
  const subsystems = body.role === 'subsystem_owner' ? body.subsystems : [];
  const membership = await changeMemberships(sequelize, craftId, async (transaction) => {
    const existing = await Membership.findOne({ where: { craftId, userId: person.id }, transaction });
    if (!existing) return Membership.create({ craftId, userId: person.id, role: body.role, subsystems }, { transaction });
    if (body.role !== 'chief_engineer') await keepOneChiefEngineer(existing, transaction);
    return existing.update({ role: body.role, subsystems }, { transaction });
  });
  return toMemberDto(membership, person);
}

/** Takes a person off the craft. */
export async function removeMember(sequelize: Sequelize, user: User, craftId: string, memberId: string): Promise<void> {
  await authorizeCraft(user, craftId, 'manageMembers');
  await changeMemberships(sequelize, craftId, async (transaction) => {
    const membership = await Membership.findOne({ where: { craftId, userId: memberId }, transaction });
    if (!membership) throw notFound('Member');
    await keepOneChiefEngineer(membership, transaction);
    await membership.destroy({ transaction });
  });
}

/** A craft keeps at least one chief engineer, so that its baselines can always be locked. */
async function keepOneChiefEngineer(leaving: Membership, transaction: Transaction) {
  if (leaving.role !== 'chief_engineer') return;
  const chiefs = await Membership.count({ where: { craftId: leaving.craftId, role: 'chief_engineer' }, transaction });
  if (chiefs <= 1) throw new HttpError(409, 'last_chief_engineer', 'A craft keeps at least one chief engineer; appoint another first');
}
