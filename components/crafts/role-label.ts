import { craftRoleLabels, type CraftRole } from '@/shared/schemas/roles';

/** The caller's standing on a craft in words; org admins who are not members see it as admins. */
export function myRoleLabel(role: CraftRole | null): string {
  return role === null ? 'Organisation admin' : craftRoleLabels[role];
}
