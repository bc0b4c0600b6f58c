import type { Sequelize, Transaction } from 'sequelize';
import { mayOnCraft } from '@/shared/access/permissions';
import type { Member, SetMemberBody } from '@/shared/schemas/members';
import { HttpError, notFound } from '../http-error';
import { Craft, Membership, User } from '../models';
import { recordAudit } from './audit';
import { authorizeCraft } from './craft-access';
import { selectSubsystems, type SubsystemRecord } from './sheet-store';

/** Roles whose membership names subsystems: the ones an owner edits, or the ones shared with a partner. */
const rolesWithSubsystems: ReadonlySet<SetMemberBody['role']> = new Set(['subsystem_owner', 'partner']);

/** The names of the subsystems a membership names (memberships hold ids; the API speaks names, as the member editor does). */
function subsystemNames(subsystemIds: readonly string[], subsystems: readonly SubsystemRecord[]): string[] {
  return subsystems.filter((subsystem) => subsystemIds.includes(subsystem.id)).map((subsystem) => subsystem.name);
}

function toMemberDto(membership: Membership, user: User, subsystems: readonly SubsystemRecord[], withContact = true): Member {
  return {
    userId: user.id,
    name: user.name,
    ...(withContact ? { email: user.email } : {}),
    role: membership.role,
    subsystems: subsystemNames(membership.subsystemIds, subsystems),
  };
}

/** A person's standing on the craft for the audit log: role and subsystems by name, or null when not a member. */
type Standing = { role: Membership['role']; subsystems: string[] } | null;

function standingOfMembership(membership: Membership | null, subsystems: readonly SubsystemRecord[]): Standing {
  return membership === null ? null : { role: membership.role, subsystems: subsystemNames(membership.subsystemIds, subsystems) };
}

/** Records a change of a person's role (joining: before null; leaving: after null) in the audit log, unless nothing changed. */
async function recordRoleChange(
  sequelize: Sequelize,
  transaction: Transaction,
  change: { craft: Craft; actor: User; person: Pick<User, 'id' | 'name'>; before: Standing; after: Standing },
) {
  if (JSON.stringify(change.before) === JSON.stringify(change.after)) return;
  await recordAudit(sequelize, transaction, {
    organisationId: change.craft.organisationId,
    craftId: change.craft.id,
    actorId: change.actor.id,
    action: 'role_changed',
    subject: change.person.name,
    details: { userId: change.person.id, before: change.before, after: change.after },
  });
}

/** The craft's members with their roles, by name; their e-mail addresses only for those the permission table lets see contacts. */
export async function listMembers(sequelize: Sequelize, user: User, craftId: string): Promise<Member[]> {
  const access = await authorizeCraft(user, craftId, 'viewMembers');
  const withContact = mayOnCraft('viewContacts', access);
  const memberships = await Membership.findAll({ where: { craftId }, include: [{ model: User, as: 'user' }] });
  const subsystems = await selectSubsystems(sequelize, craftId);
  return memberships
    .flatMap((membership) => (membership.user ? [toMemberDto(membership, membership.user, subsystems, withContact)] : []))
    .sort((a, b) => a.name.localeCompare(b.name));
}

/** The ids of the named subsystems of the craft; 400 naming each name the craft does not have. */
function subsystemIdsOf(names: readonly string[], subsystems: readonly SubsystemRecord[]): string[] {
  const problems = names.flatMap((name, index) =>
    subsystems.some((subsystem) => subsystem.name === name)
      ? []
      : [{ path: `body.subsystems.${index}`, message: `the craft has no subsystem "${name}"` }],
  );
  if (problems.length > 0)
    throw new HttpError(400, 'invalid_input', `Invalid input: ${problems.map((p) => `${p.path} ${p.message}`).join('; ')}`, problems);
  return subsystems.filter((subsystem) => names.includes(subsystem.name)).map((subsystem) => subsystem.id);
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

/**
 * Adds a person of the same organisation to the craft, or changes their role. Subsystem owners and
 * partners name subsystems the craft has (owned, or shared with the partner).
 */
export async function setMember(sequelize: Sequelize, user: User, craftId: string, memberId: string, body: SetMemberBody): Promise<Member> {
  const { craft } = await authorizeCraft(user, craftId, 'manageMembers');
  const person = await User.findOne({ where: { id: memberId, organisationId: craft.organisationId } });
  if (!person) throw notFound('Person');
  const subsystems = await selectSubsystems(sequelize, craftId);
  const subsystemIds = rolesWithSubsystems.has(body.role) ? subsystemIdsOf(body.subsystems, subsystems) : [];
  const membership = await changeMemberships(sequelize, craftId, async (transaction) => {
    const existing = await Membership.findOne({ where: { craftId, userId: person.id }, transaction });
    const before = standingOfMembership(existing, subsystems);
    if (existing && body.role !== 'chief_engineer') await keepOneChiefEngineer(existing, transaction);
    const saved = existing
      ? await existing.update({ role: body.role, subsystemIds }, { transaction })
      : await Membership.create({ craftId, userId: person.id, role: body.role, subsystemIds }, { transaction });
    await recordRoleChange(sequelize, transaction, { craft, actor: user, person, before, after: standingOfMembership(saved, subsystems) });
    return saved;
  });
  return toMemberDto(membership, person, subsystems);
}

/** Takes a person off the craft. */
export async function removeMember(sequelize: Sequelize, user: User, craftId: string, memberId: string): Promise<void> {
  const { craft } = await authorizeCraft(user, craftId, 'manageMembers');
  const subsystems = await selectSubsystems(sequelize, craftId);
  await changeMemberships(sequelize, craftId, async (transaction) => {
    const membership = await Membership.findOne({
      where: { craftId, userId: memberId },
      include: [{ model: User, as: 'user' }],
      transaction,
    });
    if (!membership?.user) throw notFound('Member');
    await keepOneChiefEngineer(membership, transaction);
    await membership.destroy({ transaction });
    const before = standingOfMembership(membership, subsystems);
    await recordRoleChange(sequelize, transaction, { craft, actor: user, person: membership.user, before, after: null });
  });
}

/** A craft keeps at least one chief engineer, so that its baselines can always be locked. */
async function keepOneChiefEngineer(leaving: Membership, transaction: Transaction) {
  if (leaving.role !== 'chief_engineer') return;
  const chiefs = await Membership.count({ where: { craftId: leaving.craftId, role: 'chief_engineer' }, transaction });
  if (chiefs <= 1) throw new HttpError(409, 'last_chief_engineer', 'A craft keeps at least one chief engineer; appoint another first');
}
