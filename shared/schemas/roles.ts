import { z } from 'zod';

/** Roles a person can hold on one craft, from least to most authority. */
export const craftRoles = ['viewer', 'partner', 'subsystem_owner', 'systems_engineer', 'chief_engineer'] as const;
export const craftRoleSchema = z.enum(craftRoles);
export type CraftRole = z.infer<typeof craftRoleSchema>;

/** Human labels for the craft roles, used by screens and e-mails. */
export const craftRoleLabels: Record<CraftRole, string> = {
  viewer: 'Viewer',
  partner: 'Partner',
  subsystem_owner: 'Subsystem owner',
  systems_engineer: 'Systems engineer',
  chief_engineer: 'Chief engineer',
};
