import type { Sequelize } from 'sequelize';
import { Op } from 'sequelize';
import type { Craft as CraftDto, CreateCraftBody, UpdateCraftBody } from '@/shared/schemas/crafts';
import type { CraftRole } from '@/shared/schemas/roles';
import { Craft, Membership, type User } from '../models';
import { authorizeCraft } from './craft-access';

function toCraftDto(craft: Craft, myRole: CraftRole | null): CraftDto {
  return {
    id: craft.id,
    organisationId: craft.organisationId,
    name: craft.name,
    description: craft.description,
    myRole,
    createdAt: craft.createdAt.toISOString(),
    updatedAt: craft.updatedAt.toISOString(),
  };
}

/** Crafts the person is a member of; an organisation admin sees every craft of the organisation. */
export async function listCrafts(user: User): Promise<CraftDto[]> {
  const memberships = await Membership.findAll({ where: { userId: user.id } });
  const roleByCraft = new Map(memberships.map((m) => [m.craftId, m.role]));
  const crafts = await Craft.findAll({
    where: {
      organisationId: user.organisationId,
      ...(user.isOrgAdmin ? {} : { id: { [Op.in]: [...roleByCraft.keys()] } }),
    },
    order: [['name', 'ASC']],
  });
  return crafts.map((craft) => toCraftDto(craft, roleByCraft.get(craft.id) ?? null));
}

/** Creates a craft in the admin's organisation; the creator becomes its chief engineer. */
export async function createCraft(sequelize: Sequelize, user: User, body: CreateCraftBody): Promise<CraftDto> {
  return sequelize.transaction(async (transaction) => {
    const craft = await Craft.create({ ...body, organisationId: user.organisationId, createdById: user.id }, { transaction });
    await Membership.create({ craftId: craft.id, userId: user.id, role: 'chief_engineer' }, { transaction });
    return toCraftDto(craft, 'chief_engineer');
  });
}

/** The craft as the person sees it. */
export async function getCraft(user: User, craftId: string): Promise<CraftDto> {
  const access = await authorizeCraft(user, craftId, 'viewCraft');
  return toCraftDto(access.craft, access.role);
}

/** Renames or re-describes a craft. */
export async function updateCraft(user: User, craftId: string, body: UpdateCraftBody): Promise<CraftDto> {
  const access = await authorizeCraft(user, craftId, 'editCraftDetails');
  await access.craft.update(body);
  return toCraftDto(access.craft, access.role);
}
