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
  /** The person's id: a study's owner (who opened it) edits all of it. Without it, nobody is an owner. */
  readonly userId?: string;
}

/** Actions on the organisation itself (what of its directory a person sees: `directoryReach`). */
export const organisationPermissions = {
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
  /** Edit and save the craft's own allowance table, which the mass budget then reads in place of a preset. */
  editAllowanceTable: { roles: engineers, orgAdmin: false },
  /** Lock the working draft as a baseline for a design review. */
  lockBaseline: { roles: ['chief_engineer'], orgAdmin: false },
  /** Open a study (a named branch) from any revision: whoever may edit rows. */
  openStudy: { roles: ['subsystem_owner', ...engineers], orgAdmin: false },
  /** Merge a study into the working draft. */
  promoteStudy: { roles: ['chief_engineer'], orgAdmin: false },
  /**
   * Import a workbook against a revision: a preview, then a study opened from it (which rows it may change is
   * `importRow`).
   */
  importWorkbook: { roles: ['partner', 'subsystem_owner', ...engineers], orgAdmin: false },
  /** Read and export the craft's audit log (locks, promotions, role changes, tokens). */
  viewAudit: { roles: ['chief_engineer'], orgAdmin: true },
  /**
   * See the e-mail addresses and admin flags of people: of the craft's members, and (holding such a role on
   * any craft) of the whole organisation. Partners, outside suppliers, see names only.
   */
  viewContacts: { roles: fullReaders, orgAdmin: true },
} as const satisfies Record<string, { roles: readonly CraftRole[]; orgAdmin: boolean }>;

export type CraftAction = keyof typeof craftPermissions;

/** Whether a person with this role on the craft (null: none) and admin flag may take the action. */
export function mayOnCraft(action: CraftAction, who: Who): boolean {
  const rule = craftPermissions[action];
  if (who.isOrgAdmin && rule.orgAdmin) return true;
  return who.role !== null && (rule.roles as readonly CraftRole[]).includes(who.role);
}

/**
 * What of the organisation's directory a person sees, from their admin flag and their roles on its crafts:
 * everyone with e-mail addresses and admin flags ('organisation') for admins and whoever may see contacts on
 * some craft; otherwise, for partners and people without a role yet, only the names of the members of their
 * own crafts ('craft_members').
 */
export function directoryReach(who: {
  readonly isOrgAdmin: boolean;
  readonly roles: readonly CraftRole[];
}): 'organisation' | 'craft_members' {
  const seesContacts = who.isOrgAdmin || who.roles.some((role) => mayOnCraft('viewContacts', { role, isOrgAdmin: false }));
  return seesContacts ? 'organisation' : 'craft_members';
}

/**
 * Where a revision stands: its kind, whether it is locked (a baseline, a promoted study) or still open for
 * edits, and who created it (a study's owner). The API's revision satisfies it.
 */
export interface RevisionStanding {
  readonly kind: 'draft' | 'baseline' | 'study';
  readonly state: 'open' | 'locked';
  readonly createdBy?: { readonly id: string } | null;
}

/** The standing of a stored revision (its creator by id). */
export function standingOf(revision: {
  readonly kind: RevisionStanding['kind'];
  readonly state: RevisionStanding['state'];
  readonly createdById: string | null;
}): RevisionStanding {
  return { kind: revision.kind, state: revision.state, createdBy: revision.createdById === null ? null : { id: revision.createdById } };
}

/**
 * Which rows a role reaches for an action: every row, the rows of the subsystems its membership names
 * (owned or shared), or none. `states` lists the revision states the action is possible in. `inStudy`,
 * when given, replaces `reach` in a study: subsystem ownership does not apply there, and the study's
 * owner (while they may still open studies) reaches what `owner` says.
 */
type Reach = 'all' | 'named_subsystems';
interface RowRule {
  readonly reach: Partial<Record<CraftRole, Reach>>;
  readonly orgAdmin: Reach | null;
  readonly states: readonly RevisionStanding['state'][];
  readonly inStudy?: { readonly reach: Partial<Record<CraftRole, Reach>>; readonly owner: Reach };
}

/** Actions on one row of a revision. */
export const rowPermissions = {
  /** See the row and its value. */
  viewRow: {
    reach: { viewer: 'all', partner: 'named_subsystems', subsystem_owner: 'all', systems_engineer: 'all', chief_engineer: 'all' },
    orgAdmin: 'all',
    states: ['open', 'locked'],
  },
  /** Change the row's value, formula, unit, label, note, source or maturity. In a study: its owner and the engineers. */
  editRow: {
    reach: { subsystem_owner: 'named_subsystems', systems_engineer: 'all', chief_engineer: 'all' },
    orgAdmin: null,
    states: ['open'],
    inStudy: { reach: { systems_engineer: 'all', chief_engineer: 'all' }, owner: 'all' },
  },
  /** Add, rename, reorder, move to another subsystem or delete the row. In a study: its owner and the engineers. */
  manageRow: {
    reach: { systems_engineer: 'all', chief_engineer: 'all' },
    orgAdmin: null,
    states: ['open'],
    inStudy: { reach: { systems_engineer: 'all', chief_engineer: 'all' }, owner: 'all' },
  },
  /** Attach evidence (datasheets, weighing and test reports): who edits the row, and partners on the rows shared with them. */
  attachEvidence: {
    reach: { partner: 'named_subsystems', subsystem_owner: 'named_subsystems', systems_engineer: 'all', chief_engineer: 'all' },
    orgAdmin: null,
    states: ['open'],
    inStudy: { reach: { systems_engineer: 'all', chief_engineer: 'all' }, owner: 'all' },
  },
  /** Remove anyone's evidence from the row; whoever attached a file may remove it too (`mayRemoveEvidence`). */
  removeEvidence: {
    reach: { subsystem_owner: 'named_subsystems', systems_engineer: 'all', chief_engineer: 'all' },
    orgAdmin: null,
    states: ['open'],
    inStudy: { reach: { systems_engineer: 'all', chief_engineer: 'all' }, owner: 'all' },
  },
  /**
   * Change, add or remove the row through an imported workbook. The import opens a study from the revision, so any
   * revision may be the source, locked or not; partners reach the subsystems shared with them, owners their own.
   */
  importRow: {
    reach: { partner: 'named_subsystems', subsystem_owner: 'named_subsystems', systems_engineer: 'all', chief_engineer: 'all' },
    orgAdmin: null,
    states: ['open', 'locked'],
  },
} as const satisfies Record<string, RowRule>;

export type RowAction = keyof typeof rowPermissions;

function reaches(reach: Reach, who: Who, subsystemId: string): boolean {
  return reach === 'all' || (who.subsystemIds ?? []).includes(subsystemId);
}

/** Whether the person opened this study and may still open studies (a demoted owner only reads it). */
function ownsStudy(who: Who, revision: RevisionStanding): boolean {
  return revision.kind === 'study' && who.userId !== undefined && revision.createdBy?.id === who.userId && mayOnCraft('openStudy', who);
}

/** The reaches the person has for the action in a revision of this standing: by role, as an admin, as a study's owner. */
function reachesFor(action: RowAction, who: Who, revision: RevisionStanding): Reach[] {
  const rule: RowRule = rowPermissions[action];
  if (!rule.states.includes(revision.state)) return [];
  const study = revision.kind === 'study' ? rule.inStudy : undefined;
  const byRole = who.role === null ? undefined : (study ?? rule).reach[who.role];
  return [byRole, who.isOrgAdmin ? rule.orgAdmin : null, study && ownsStudy(who, revision) ? study.owner : null].filter(
    (reach): reach is Reach => reach !== null && reach !== undefined,
  );
}

/** Whether the person may take the action on a row of the given subsystem in a revision of this standing. */
export function mayOnRow(action: RowAction, who: Who, row: { readonly subsystemId: string }, revision: RevisionStanding): boolean {
  return reachesFor(action, who, revision).some((reach) => reaches(reach, who, row.subsystemId));
}

/**
 * Whether the action is possible on at least one row of the revision: what a screen checks before
 * offering an edit control at all, and what the server checks before a row is named.
 */
export function mayOnAnyRow(action: RowAction, who: Who, revision: RevisionStanding): boolean {
  return reachesFor(action, who, revision).some((reach) => reach === 'all' || (who.subsystemIds ?? []).length > 0);
}

/** Whether the person may remove this file from the row: by `removeEvidence`, or as the one who attached it while they may attach. */
export function mayRemoveEvidence(
  who: Who,
  row: { readonly subsystemId: string },
  revision: RevisionStanding,
  attachment: { readonly uploadedById: string | null },
): boolean {
  if (mayOnRow('removeEvidence', who, row, revision)) return true;
  return who.userId !== undefined && attachment.uploadedById === who.userId && mayOnRow('attachEvidence', who, row, revision);
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
  if (!rule.states.includes(revision.state)) {
    return revision.kind === 'study'
      ? 'This study was promoted and is locked: its rows cannot change'
      : `This ${revision.kind} is locked: its rows cannot change`;
  }
  if (action === 'importRow') {
    return who.role === 'partner'
      ? `Rows of "${row.subsystemName}" are not shared with you`
      : `Rows of "${row.subsystemName}" are changed by their owner or an engineer`;
  }
  if (revision.kind === 'study' && rule.inStudy && mayOnCraft('openStudy', who)) {
    return 'A study is changed by its owner and by systems and chief engineers; open a study of your own to try changes';
  }
  if ((action === 'editRow' || action === 'attachEvidence') && who.role === 'subsystem_owner') {
    return `You own other subsystems; rows of "${row.subsystemName}" are edited by their owner or an engineer`;
  }
  if (action === 'removeEvidence') {
    return 'Evidence is removed by whoever attached it, the owner of its subsystem or an engineer';
  }
  if (action === 'manageRow' && who.role === 'subsystem_owner') {
    return 'Adding, renaming, moving and deleting rows is for systems and chief engineers';
  }
  if (who.role === 'partner') return 'Partners read the rows shared with them and send changes as a workbook';
  if (who.role === 'viewer') return 'Viewers read the sheet but do not change it';
  if (who.role === null && who.isOrgAdmin) return 'Organisation admins read the sheet; a role on the craft is needed to change it';
  return 'Your role on this craft does not allow this';
}
