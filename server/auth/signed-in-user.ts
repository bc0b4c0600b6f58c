import { Organisation, User } from '../models';

/**
 * The columns of a person and their organisation that a signed-in request needs, for a query joining `users u`
 * and `organisations o`: the session and token look-ups read them in the same statement as the session or token.
 */
export const signedInUserColumns = `u.id, u.organisation_id AS "organisationId", u.email, u.name, u.is_org_admin AS "isOrgAdmin",
  u.created_at AS "createdAt", u.updated_at AS "updatedAt", o.name AS "organisationName", o.slug AS "organisationSlug",
  o.created_at AS "organisationCreatedAt", o.updated_at AS "organisationUpdatedAt"`;

/** A row of `signedInUserColumns`. */
export interface SignedInUserRecord {
  id: string;
  organisationId: string;
  email: string;
  name: string;
  isOrgAdmin: boolean;
  createdAt: Date;
  updatedAt: Date;
  organisationName: string;
  organisationSlug: string;
  organisationCreatedAt: Date;
  organisationUpdatedAt: Date;
}

/** The person of a record with their organisation, built afresh (each request gets its own instance to hold). */
export function signedInUser(record: SignedInUserRecord): User {
  const user = User.build(
    {
      id: record.id,
      organisationId: record.organisationId,
      email: record.email,
      name: record.name,
      isOrgAdmin: record.isOrgAdmin,
      createdAt: record.createdAt,
      updatedAt: record.updatedAt,
    },
    { isNewRecord: false, raw: true },
  );
  user.organisation = Organisation.build(
    {
      id: record.organisationId,
      name: record.organisationName,
      slug: record.organisationSlug,
      createdAt: record.organisationCreatedAt,
      updatedAt: record.organisationUpdatedAt,
    },
    { isNewRecord: false, raw: true },
  );
  return user;
}
