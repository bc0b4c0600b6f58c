import { Op, col, fn, where, type Sequelize } from 'sequelize';
import { directoryReach } from '@/shared/access/permissions';
import type { InviteBody, Invitation as InvitationDto, OrganisationResponse, Person } from '@/shared/schemas/organisation';
import { HttpError, notFound } from '../http-error';
import { enforceRateLimit, type RateLimitRule } from '../middleware/rate-limit';
import { Identity, Invitation, Membership, Organisation, User } from '../models';
import type { Mailer } from './mailer';

function toPersonDto(user: User): Person {
  return { id: user.id, name: user.name, email: user.email, isOrgAdmin: user.isOrgAdmin };
}

function toInvitationDto(invitation: Invitation): InvitationDto {
  return {
    id: invitation.id,
    email: invitation.email,
    name: invitation.name,
    provider: invitation.provider,
    invitedBy: invitation.invitedBy?.name ?? '',
    createdAt: invitation.createdAt.toISOString(),
    acceptedAt: invitation.acceptedAt ? invitation.acceptedAt.toISOString() : null,
    withdrawnAt: invitation.withdrawnAt ? invitation.withdrawnAt.toISOString() : null,
  };
}

/** The person's organisation: the one the session loaded with them, else read from the database. */
async function organisationOf(user: User): Promise<Organisation> {
  return user.organisation ?? Organisation.findByPk(user.organisationId, { rejectOnEmpty: true });
}

/**
 * The people the person may see, as the permission table's `directoryReach` says: everyone of the
 * organisation with e-mail and admin flag, or the names of the members of the person's own crafts.
 */
async function directoryOf(user: User): Promise<Pick<OrganisationResponse, 'directory' | 'people'>> {
  const memberships = await Membership.findAll({ where: { userId: user.id } });
  const directory = directoryReach({ isOrgAdmin: user.isOrgAdmin, roles: memberships.map((membership) => membership.role) });
  if (directory === 'organisation') {
    const people = await User.findAll({ where: { organisationId: user.organisationId }, order: [['name', 'ASC']] });
    return { directory, people: people.map(toPersonDto) };
  }
  const colleagues = await User.findAll({
    where: { organisationId: user.organisationId },
    include: [
      { model: Membership, as: 'memberships', where: { craftId: memberships.map((m) => m.craftId) }, attributes: [], required: true },
    ],
    order: [['name', 'ASC']],
  });
  const people = colleagues.some((colleague) => colleague.id === user.id) ? colleagues : [user, ...colleagues];
  return { directory, people: people.map(({ id, name }) => ({ id, name })) };
}

/** The person's organisation and the people they may see; invitations, withdrawn and accepted ones included, only for admins. */
export async function getOrganisation(user: User): Promise<OrganisationResponse> {
  const organisation = await organisationOf(user);
  const invitations = user.isOrgAdmin
    ? await Invitation.findAll({
        where: { organisationId: user.organisationId },
        include: [{ model: User, as: 'invitedBy' }],
        order: [['createdAt', 'DESC']],
      })
    : [];
  return {
    organisation: { id: organisation.id, name: organisation.name },
    ...(await directoryOf(user)),
    invitations: invitations.map(toInvitationDto),
  };
}

/** Invitations one admin may send in an hour, and all admins of one organisation together. */
export const invitationLimits = {
  perAdmin: { name: 'invitations_per_admin', limit: 20, windowMs: 60 * 60_000 },
  perOrganisation: { name: 'invitations_per_organisation', limit: 60, windowMs: 60 * 60_000 },
} as const satisfies Record<string, RateLimitRule>;

/**
 * Text from people's input, as data inside a fixed mail text: in quotes, with quotes, backslashes, control and
 * format characters (line breaks, bidirectional overrides) written as escapes, so it can neither break a line
 * nor pose as the mail's own words.
 */
export function quotedForMail(text: string): string {
  const escaped = text.replace(/["\\]|[\p{Cc}\p{Cf}\u2028\u2029]/gu, (character) =>
    character === '"' || character === '\\' ? `\\${character}` : `\\u{${(character.codePointAt(0) ?? 0).toString(16)}}`,
  );
  return `"${escaped}"`;
}

/** A header value of one line: any control or format character becomes a space. */
const headerText = (text: string) => text.replace(/[\p{Cc}\p{Cf}\u2028\u2029]+/gu, ' ').trim();

/** The invitation mail: a fixed text; the names people typed appear only quoted, as data. */
export function invitationMail(invitation: { email: string; name: string }, admin: User, organisation: Organisation, publicUrl: string) {
  return {
    to: invitation.email,
    subject: headerText(`${admin.name} invited you to ${organisation.name} on Trimsheet`),
    text: [
      'Hello,',
      '',
      'You are invited to join an organisation on Trimsheet, where the team sizes its solar sails and keeps its mass budget.',
      '',
      `Organisation: ${quotedForMail(organisation.name)}`,
      `Invited by: ${quotedForMail(admin.name)}`,
      `Invitation for: ${quotedForMail(invitation.name)} <${invitation.email}>`,
      '',
      `Sign in with this e-mail address at ${publicUrl}/sign-in to accept.`,
      'If you did not expect this invitation, ignore this mail.',
    ].join('\n'),
  };
}

const sameEmail = (email: string) => where(fn('lower', col('email')), email);

/** 409 unless a person of the organisation with the address may be invited: only to link a provider they do not have. */
async function refuseMember(member: User, body: InviteBody) {
  if (body.provider === null) {
    throw new HttpError(409, 'already_a_person', `${body.email} is already in your organisation`, [
      { path: 'body.email', message: 'is already in your organisation; to add a way to sign in, invite them for that provider' },
    ]);
  }
  if ((await Identity.count({ where: { userId: member.id, provider: body.provider } })) > 0) {
    throw new HttpError(409, 'already_linked', `${body.email} already signs in with this provider`, [
      { path: 'body.provider', message: 'is already linked for this person' },
    ]);
  }
}

/**
 * Records an invitation and e-mails it; at most `invitationLimits` per admin and per organisation in an hour
 * (429 rate_limited, counted in PostgreSQL). A new person accepts it at their first sign-in with the address;
 * when several organisations invited it, they choose. An invitation naming a provider may also go to a person
 * of the organisation, and then links that provider's sign-in to them. A pending invitation of the
 * organisation for the address is updated rather than doubled. The mail goes out after the row is committed;
 * if sending fails the invitation stays and the admin is told so, and can send it again.
 */
export async function invitePerson(
  sequelize: Sequelize,
  mailer: Mailer,
  publicUrl: string,
  admin: User,
  body: InviteBody,
): Promise<InvitationDto> {
  await enforceRateLimit(sequelize, invitationLimits.perAdmin, admin.id, 'invitations from you');
  await enforceRateLimit(sequelize, invitationLimits.perOrganisation, admin.organisationId, 'invitations from your organisation');
  // Only a member of the admin's own organisation is looked at: answering differently for another
  // organisation's people would let admins probe who has an account elsewhere.
  const member = await User.findOne({ where: { [Op.and]: [sameEmail(body.email), { organisationId: admin.organisationId }] } });
  if (member) await refuseMember(member, body);
  const invitation = await sequelize.transaction(async (transaction) => {
    const pending = await Invitation.findOne({
      where: { [Op.and]: [sameEmail(body.email), { organisationId: admin.organisationId, acceptedAt: null, withdrawnAt: null }] },
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    const fields = { name: body.name, provider: body.provider, invitedById: admin.id };
    if (pending) return pending.update(fields, { transaction });
    return Invitation.create({ ...fields, email: body.email, organisationId: admin.organisationId }, { transaction });
  });
  const organisation = await organisationOf(admin);
  try {
    await mailer.send(invitationMail(invitation, admin, organisation, publicUrl));
  } catch {
    throw new HttpError(502, 'mail_not_sent', `The invitation to ${body.email} is saved but the e-mail could not be sent; try again later`);
  }
  invitation.invitedBy = admin;
  return toInvitationDto(invitation);
}

/**
 * Withdraws a pending invitation of the admin's organisation: it can no longer be accepted. Withdrawing one
 * already withdrawn changes nothing; an accepted one is 409 (the person has joined). Locked against a sign-in
 * accepting it at the same moment.
 */
export async function withdrawInvitation(sequelize: Sequelize, admin: User, invitationId: string): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const invitation = await Invitation.findOne({
      where: { id: invitationId, organisationId: admin.organisationId },
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    if (!invitation) throw notFound('Invitation');
    if (invitation.acceptedAt)
      throw new HttpError(409, 'invitation_accepted', 'This invitation was already accepted; the person has joined');
    if (invitation.withdrawnAt) return;
    await invitation.update({ withdrawnAt: new Date(), withdrawnById: admin.id }, { transaction });
  });
}

/**
 * Grants or withdraws organisation admin rights; the organisation always keeps one admin. The
 * organisation's row is locked so that two withdrawals at the same moment cannot both pass the check.
 */
export async function setOrgAdmin(sequelize: Sequelize, admin: User, personId: string, isOrgAdmin: boolean): Promise<Person> {
  return sequelize.transaction(async (transaction) => {
    await Organisation.findByPk(admin.organisationId, { lock: transaction.LOCK.UPDATE, transaction });
    const person = await User.findOne({ where: { id: personId, organisationId: admin.organisationId }, transaction });
    if (!person) throw notFound('Person');
    if (!isOrgAdmin && person.isOrgAdmin) {
      const admins = await User.count({ where: { organisationId: admin.organisationId, isOrgAdmin: true }, transaction });
      if (admins <= 1) throw new HttpError(409, 'last_admin', 'The organisation keeps at least one admin; appoint another first');
    }
    return toPersonDto(await person.update({ isOrgAdmin }, { transaction }));
  });
}
