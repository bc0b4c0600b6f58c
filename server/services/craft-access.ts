import { mayOnCraft, type CraftAction } from '@/shared/access/permissions';
import type { CraftRole } from '@/shared/schemas/roles';
import { forbidden, notFound } from '../http-error';
import { Craft, Membership, type User } from '../models';

export interface CraftAccess {
  craft: Craft;
  role: CraftRole | null;
  isOrgAdmin: boolean;
}

/**
 * Loads a craft as the given person sees it. A craft of another organisation, or one the person is
 * neither a member nor an admin of, is reported as not found so its existence does not leak.
 */
async function loadCraftAccess(user: User, craftId: string): Promise<CraftAccess> {
  const craft = await Craft.findOne({ where: { id: craftId, organisationId: user.organisationId } });
  if (!craft) throw notFound('Craft');
  const membership = await Membership.findOne({ where: { craftId, userId: user.id } });
  if (!membership && !user.isOrgAdmin) throw notFound('Craft');
  return { craft, role: membership?.role ?? null, isOrgAdmin: user.isOrgAdmin };
}

/** Loads the craft and checks the action against the permission table: 404 if invisible, 403 if not allowed. */
export async function authorizeCraft(user: User, craftId: string, action: CraftAction): Promise<CraftAccess> {
  const access = await loadCraftAccess(user, craftId);
  if (!mayOnCraft(action, access)) throw forbidden(`Your role on this craft does not allow this (${action})`);
  return access;
}
