import { craftRoles, type CraftRole } from '../schemas/roles';

/**
 * Who may do what, in one place: organisation actions, craft actions, and actions on a revision's rows
 * that depend on the row's subsystem and on the revision's state. The server enforces these tables on
 * every request; the client reads the same tables to hide what a person cannot do. Anything not listed
 * is denied. Organisation admins manage people and crafts of their organisation but, unless they also
 * hold a role on a craft, do not edit its engineering data.
 */

/** A person as the tables see them: their role on the craft (null: none) and the organisation-admin flag. */
export interface Who {
  readonly role: CraftRole | null;
  readonly isOrgAdmin: boolean;
  /**
   * Subsystem ids the person's membership names: the rows a subsystem owner owns, or the subsystems
   * shared with a partner. Ignored for the other roles.
   */
  readonly subsystemIds?: readonly string[];
}

/** Actions on the organisation itself. */
export const organisationPermissions = {
  viewDirectory: { orgAdmin: true, member: true },
  createCraft: { orgAdmin: true, member: false },
  invitePeople: { orgAdmin: true, member: false },
  setOrgAdmin: { orgAdmin: true, member: false },
} as const satisfies Record<string, { orgAdmin: boolean; member: boolean }>;

export type OrganisationAction = keyof typeof organisationPermissions;

/** Whether a person of the organisation (admin or not) may take the organisation-wide action. */
export function mayInOrganisation(action: OrganisationAction, who: { isOrgAdmin: boolean }): boolean {
  const rule = organisationPermissions[action];
  return who.isOrgAdmin ? rule.orgAdmin : rule.member;
}

const engineers = ['systems_engineer', 'chief_engineer'] as const;
const fullReaders = ['viewer', 'subsystem_owner', 'systems_engineer', 'chief_engineer'] as const;

/** Actions on a craft as a whole. */
export const craftPermissions = {
  viewCraft: { roles: craftRoles, orgAdmin: true },
  editCraftDetails: { roles: ['chief_engineer'], orgAdmin: true },
  viewMembers: { roles: craftRoles, orgAdmin: true },
  manageMembers: { roles: [], orgAdmin: true },
  /** Copy the craft's sheet into a new craft (needs the whole sheet, so not partners). */
  copyCraft: { roles: fullReaders, orgAdmin: true },
  /** Read every row of every revision (partners read only the rows shared with them). */
  viewWholeSheet: { roles: fullReaders, orgAdmin: true },
  /** Add, rename and remove subsystems. */
  manageSubsystems: { roles: engineers, orgAdmin: false },
} as const satisfies Record<string, { roles: readonly CraftRole[]; orgAdmin: boolean }>;

export type CraftAction = keyof typeof craftPermissions;

/** Whether a person with this role on the craft (null: none) and admin flag may take the action. */
export function mayOnCraft(action: CraftAction, who: Who): boolean {
  const rule = craftPermissions[action];
  if (who.isOrgAdmin && rule.orgAdmin) return true;
  return who.role !== null && (rule.roles as readonly CraftRole[]).includes(who.role);
}

/** Where a revision stands: its kind and whether it is locked (a baseline) or still open for edits. */
export interface RevisionStanding {
  readonly kind: 'draft' | 'baseline' | 'study';
  readonly state: 'open' | 'locked';
}

/**
 * Which rows a role reaches for an action: every row, the rows of the subsystems its membership names
 * (owned or shared), or none. `states` lists the revision states the action is possible in.
 */
type Reach = 'all' | 'named_subsystems';
interface RowRule {
  readonly reach: Partial<Record<CraftRole, Reach>>;
  readonly orgAdmin: Reach | null;
  readonly states: readonly RevisionStanding['state'][];
}

/** Actions on one row of a revision. */
export const rowPermissions = {
  /** See the row and its value. */
  viewRow: {
    reach: { viewer: 'all', partner: 'named_subsystems', subsystem_owner: 'all', systems_engineer: 'all', chief_engineer: 'all' },
    orgAdmin: 'all',
    states: ['open', 'locked'],
  },
  /** Change the row's value, formula, unit, label, note, source or maturity. */
  editRow: {
    reach: { subsystem_owner: 'named_subsystems', systems_engineer: 'all', chief_engineer: 'all' },
    orgAdmin: null,
    states: ['open'],
  },
  /** Add, rename, reorder, move to another subsystem or delete the row. */
  manageRow: {
    reach: { systems_engineer: 'all', chief_engineer: 'all' },
    orgAdmin: null,
    states: ['open'],
  },
} as const satisfies Record<string, RowRule>;

export type RowAction = keyof typeof rowPermissions;

function reaches(reach: Reach | null | undefined, who: Who, subsystemId: string): boolean {
  if (reach === 'all') return true;
  if (reach === 'named_subsystems') return (who.subsystemIds ?? []).includes(subsystemId);
  return false;
}

/** Whether the person may take the action on a row of the given subsystem in a revision of this standing. */
export function mayOnRow(action: RowAction, who: Who, row: { readonly subsystemId: string }, revision: RevisionStanding): boolean {
  const rule: RowRule = rowPermissions[action];
  if (!rule.states.includes(revision.state)) return false;
  const byRole = who.role === null ? false : reaches(rule.reach[who.role], who, row.subsystemId);
  return byRole || (who.isOrgAdmin && reaches(rule.orgAdmin, who, row.subsystemId));
}

/**
 * Whether the action is possible on at least one row of the revision: what a screen checks before
 * offering an edit control at all, and what the server checks before a row is named.
 */
export function mayOnAnyRow(action: RowAction, who: Who, revision: RevisionStanding): boolean {
  const rule: RowRule = rowPermissions[action];
  if (!rule.states.includes(revision.state)) return false;
  const reach = who.role === null ? undefined : rule.reach[who.role];
  const adminReach = who.isOrgAdmin ? rule.orgAdmin : null;
  const some = (r: Reach | null | undefined) => r === 'all' || (r === 'named_subsystems' && (who.subsystemIds ?? []).length > 0);
  return some(reach) || some(adminReach);
}

/**
 * Why the person may not take the action on the row, in words for the screen and the API's 403; undefined
 * when they may.
 */
export function whyNotOnRow(
  action: RowAction,
  who: Who,
  row: { readonly subsystemId: string; readonly subsystemName: string },
  revision: RevisionStanding,
): string | undefined {
  if (mayOnRow(action, who, row, revision)) return undefined;
  const rule: RowRule = rowPermissions[action];
  if (!rule.states.includes(revision.state)) return `This ${revision.kind} is locked: its rows cannot change`;
  if (action === 'editRow' && who.role === 'subsystem_owner') {
    return `You own other subsystems; rows of "${row.subsystemName}" are edited by their owner or an engineer`;
  }
  if (action === 'manageRow' && who.role === 'subsystem_owner') {
    return 'Adding, renaming, moving and deleting rows is for systems and chief engineers';
  }
  if (who.role === 'partner') return 'Partners read the rows shared with them and send changes as a workbook';
  if (who.role === 'viewer') return 'Viewers read the sheet but do not change it';
  if (who.role === null && who.isOrgAdmin) return 'Organisation admins read the sheet; a role on the craft is needed to change it';
  return 'Your role on this craft does not allow this';
}
