import type { Sequelize } from 'sequelize';
import { mayOnCraft } from '@/shared/access/permissions';
import type { Craft as CraftDto, CreateCraftBody, UpdateCraftBody } from '@/shared/schemas/crafts';
import type { CraftRole } from '@/shared/schemas/roles';
import type { Sheet } from '@/shared/schemas/sheet';
import { findTemplate, instantiateTemplate } from '@/shared/templates';
import { HttpError, notFound } from '../http-error';
import { Craft, Membership, type User } from '../models';
import { preparedQuery } from '../models/prepared-query';
import { authorizeCraft, loadCraftAccess } from './craft-access';
import { createDraft, draftIdOf, draftSheet } from './sheet-store';

function toCraftDto(craft: Craft, myRole: CraftRole | null, draftRevisionId: string | null): CraftDto {
  return {
    id: craft.id,
    organisationId: craft.organisationId,
    name: craft.name,
    description: craft.description,
    myRole,
    templateId: craft.templateId,
    draftRevisionId,
    createdAt: craft.createdAt.toISOString(),
    updatedAt: craft.updatedAt.toISOString(),
  };
}

/** A craft as the list reads it: the craft, the person's role on it and its draft, in one row. */
interface CraftListRecord extends Omit<CraftDto, 'createdAt' | 'updatedAt'> {
  createdAt: Date;
  updatedAt: Date;
}

/**
 * Crafts the person is a member of; an organisation admin sees every craft of the organisation. One prepared
 * statement (the list is the first read of every screen): the crafts with the person's membership and the draft.
 */
export async function listCrafts(sequelize: Sequelize, user: User): Promise<CraftDto[]> {
  const crafts = await preparedQuery<CraftListRecord>(
    sequelize,
    `SELECT c.id, c.organisation_id AS "organisationId", c.name, c.description, m.role AS "myRole", c.template_id AS "templateId",
            r.id AS "draftRevisionId", c.created_at AS "createdAt", c.updated_at AS "updatedAt"
     FROM crafts c
     LEFT JOIN memberships m ON m.craft_id = c.id AND m.user_id = $1
     LEFT JOIN revisions r ON r.craft_id = c.id AND r.kind = 'draft'
     WHERE c.organisation_id = $2 AND ($3 OR m.id IS NOT NULL)
     ORDER BY c.name`,
    [user.id, user.organisationId, user.isOrgAdmin],
  );
  return crafts.map((craft) => ({ ...craft, createdAt: craft.createdAt.toISOString(), updatedAt: craft.updatedAt.toISOString() }));
}

/**
 * The sheet a new craft starts from: a copy of another craft's working draft (one the person may copy, of
 * their organisation: 404 otherwise, so its existence does not leak) or a template's (400 for an unknown id).
 */
async function startingSheet(sequelize: Sequelize, user: User, body: CreateCraftBody): Promise<{ sheet: Sheet; templateId: string }> {
  if (body.copyOf !== undefined) {
    const source = await loadCraftAccess(user, body.copyOf);
    if (!mayOnCraft('copyCraft', source)) throw notFound('Craft');
    return { sheet: await draftSheet(sequelize, source.craft.id), templateId: source.craft.templateId };
  }
  const templateId = body.templateId ?? 'square-sail';
  const template = findTemplate(templateId);
  if (!template) {
    throw new HttpError(400, 'invalid_input', `No template "${templateId}"`, [
      { path: 'body.templateId', message: `no template "${templateId}"` },
    ]);
  }
  return { sheet: instantiateTemplate(template), templateId };
}

/** Creates a craft in the person's organisation with its working draft; the creator becomes its chief engineer. */
export async function createCraft(sequelize: Sequelize, user: User, body: CreateCraftBody): Promise<CraftDto> {
  const { sheet, templateId } = await startingSheet(sequelize, user, body);
  return sequelize.transaction(async (transaction) => {
    const craft = await Craft.create(
      { name: body.name, description: body.description, templateId, organisationId: user.organisationId, createdById: user.id },
      { transaction },
    );
    await Membership.create({ craftId: craft.id, userId: user.id, role: 'chief_engineer' }, { transaction });
    const draftId = await createDraft(sequelize, craft.id, sheet, user.id, transaction);
    return toCraftDto(craft, 'chief_engineer', draftId);
  });
}

/** The craft as the person sees it. */
export async function getCraft(sequelize: Sequelize, user: User, craftId: string): Promise<CraftDto> {
  const access = await authorizeCraft(user, craftId, 'viewCraft');
  return toCraftDto(access.craft, access.role, await draftIdOf(sequelize, craftId));
}

/** Renames or re-describes a craft. */
export async function updateCraft(sequelize: Sequelize, user: User, craftId: string, body: UpdateCraftBody): Promise<CraftDto> {
  const access = await authorizeCraft(user, craftId, 'editCraftDetails');
  await access.craft.update(body);
  return toCraftDto(access.craft, access.role, await draftIdOf(sequelize, craftId));
}
