import type { Sequelize } from 'sequelize';
import type { InviteBody, Invitation as InvitationDto, OrganisationResponse, Person } from '@/shared/schemas/organisation';
import { HttpError, notFound } from '../http-error';
import { Invitation, Organisation, User } from '../models';
import type { Mailer } from './mailer';

function toPersonDto(user: User): Person {
  return { id: user.id, name: user.name, email: user.email, isOrgAdmin: user.isOrgAdmin };
}

function toInvitationDto(invitation: Invitation): InvitationDto {
  return {
    id: invitation.id,
    email: invitation.email,
    name: invitation.name,
    invitedBy: invitation.invitedBy?.name ?? '',
    createdAt: invitation.createdAt.toISOString(),
    acceptedAt: invitation.acceptedAt ? invitation.acceptedAt.toISOString() : null,
  };
}

/** The person's organisation: the one the session loaded with them, else read from the database. */
async function organisationOf(user: User): Promise<Organisation> {
  return user.organisation ?? Organisation.findByPk(user.organisationId, { rejectOnEmpty: true });
}

/** The person's organisation and its people; invitations only for admins. */
export async function getOrganisation(user: User): Promise<OrganisationResponse> {
  const organisation = await organisationOf(user);
  const people = await User.findAll({ where: { organisationId: user.organisationId }, order: [['name', 'ASC']] });
  const invitations = user.isOrgAdmin
    ? await Invitation.findAll({
        where: { organisationId: user.organisationId },
        include: [{ model: User, as: 'invitedBy' }],
        order: [['createdAt', 'DESC']],
      })
    : [];
  return {
    organisation: { id: organisation.id, name: organisation.name },
    people: people.map(toPersonDto),
    invitations: invitations.map(toInvitationDto),
  };
}

/**
 * Records an invitation and e-mails it. The invitation is accepted when someone with that e-mail first
 * signs in (someone who already belongs to another organisation stays there; the invitation stays open). The mail goes out after the row is committed; if sending fails the invitation stays and the
 * admin is told so, and can send it again.
 */
export async function invitePerson(
  sequelize: Sequelize,
  mailer: Mailer,
  publicUrl: string,
  admin: User,
  body: InviteBody,
): Promise<InvitationDto> {
  // Only a member of the admin's own organisation is refused: answering differently for another
  // organisation's people would let admins probe who has an account elsewhere.
  if (await User.findOne({ where: { email: body.email, organisationId: admin.organisationId } })) {
    throw new HttpError(409, 'already_a_person', `${body.email} is already in your organisation`, [
      { path: 'body.email', message: 'is already in your organisation' },
    ]);
  }
  const invitation = await sequelize.transaction(async (transaction) => {
    const pending = await Invitation.findOne({
      where: { email: body.email, organisationId: admin.organisationId, acceptedAt: null },
      transaction,
    });
    if (pending) return pending.update({ name: body.name, invitedById: admin.id }, { transaction });
    return Invitation.create({ ...body, organisationId: admin.organisationId, invitedById: admin.id }, { transaction });
  });
  const organisation = await organisationOf(admin);
  try {
    await mailer.send({
      to: body.email,
      subject: `${admin.name} invited you to ${organisation.name} on Trimsheet`,
      text: [
        `Hello ${body.name},`,
        '',
        `${admin.name} invited you to join ${organisation.name} on Trimsheet, where the team sizes its solar sails and keeps its mass budget.`,
        `Sign in with this e-mail address at ${publicUrl}/sign-in to accept.`,
      ].join('\n'),
    });
  } catch {
    throw new HttpError(502, 'mail_not_sent', `The invitation to ${body.email} is saved but the e-mail could not be sent; try again later`);
  }
  invitation.invitedBy = admin;
  return toInvitationDto(invitation);
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
