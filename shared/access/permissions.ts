import { craftRoles, type CraftRole } from '../schemas/roles';

/**
 * What each role may do on a craft, in one table that the server enforces and the client uses to hide
 * what a person cannot do. Anything not listed is denied. Organisation admins manage people and crafts
 * of their organisation but, unless they also hold a role, do not edit engineering data.
 */
export const craftPermissions = {
  viewCraft: { roles: craftRoles, orgAdmin: true },
  editCraftDetails: { roles: ['chief_engineer'], orgAdmin: true },
  viewMembers: { roles: craftRoles, orgAdmin: true },
  manageMembers: { roles: [], orgAdmin: true },
} as const satisfies Record<string, { roles: readonly CraftRole[]; orgAdmin: boolean }>;

export type CraftAction = keyof typeof craftPermissions;

/** Whether a person with this role on the craft (null: none) and admin flag may take the action. */
export function mayOnCraft(action: CraftAction, who: { role: CraftRole | null; isOrgAdmin: boolean }): boolean {
  const rule = craftPermissions[action];
  if (who.isOrgAdmin && rule.orgAdmin) return true;
  return who.role !== null && (rule.roles as readonly CraftRole[]).includes(who.role);
}
