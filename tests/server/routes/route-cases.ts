import { findPreset } from '@/shared/budget/presets';

/**
 * Every API route with the status each kind of caller gets: the role matrix calls them all, and the
 * OpenAPI test checks that each is documented. Targets are chosen so that allowed writes do not change
 * what the later rows check (no-op writes, versions that are stale on purpose, names unique per actor).
 */
export type Actor = 'signedOut' | 'ines' | 'tomas' | 'amara' | 'kenji' | 'lucia' | 'oren' | 'priya';
export const actors: Actor[] = ['signedOut', 'ines', 'tomas', 'amara', 'kenji', 'lucia', 'oren', 'priya'];

/**
 * Ids the paths are filled with: Tern, its draft, its PDR baseline, Kenji's study and Optics subsystem, two
 * people, and a token of Tomás.
 */
export interface Ids {
  craftId: string;
  revisionId: string;
  baselineId: string;
  studyId: string;
  subsystemId: string;
  ines: string;
  tomas: string;
  tokenId: string;
}

export interface RouteCase {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  /** The path as the OpenAPI document writes it, `{name}` for each parameter. */
  template: string;
  /** Fills the template's parameters; defaults to the ids of the same names. */
  fill?: (ids: Ids) => Record<string, string>;
  query?: string;
  body?: (actor: Actor) => object;
  expected: Partial<Record<Actor, number>> & { default: number };
  /** Ends the session it is called with, so it runs on a session of its own. */
  endsSession?: true;
  /** Answers with a stream that never ends on its own: read the status, then hang up. */
  stream?: true;
  /** Not an API route (the JSON 404 for unknown paths): not in the OpenAPI document. */
  undocumented?: true;
}

/** A team's own allowance table: the AIAA-style preset's cells, saved as the craft's. */
const aiaa = findPreset('aiaa-s120a');
const teamTable = {
  id: 'team-table',
  name: 'Our allowance table',
  source: 'Team copy of the AIAA-style preset',
  caveat: 'Cells copied from the preset, to be replaced with our licensed table.',
  maturities: aiaa?.maturities,
  categories: aiaa?.categories,
  table: aiaa?.table,
  systemMarginPercent: aiaa?.systemMarginPercent,
  systemMarginBasis: aiaa?.systemMarginBasis,
};

const signedInOnly = { signedOut: 401, default: 200 };
const craftMembersOnly = { signedOut: 401, priya: 404, default: 200 };
const adminsOnly = (allowed: number, otherOrg: number) => ({ signedOut: 401, ines: allowed, priya: otherOrg, default: 403 });
/** Systems and chief engineers manage rows and subsystems; everyone else on the craft is refused. */
const engineersOnly = (allowed: number) => ({ signedOut: 401, tomas: allowed, amara: allowed, priya: 404, default: 403 });
const craft = '/api/crafts/{craftId}';
const revision = `${craft}/revisions/{revisionId}`;
const actorKey = (actor: Actor) => `matrix_${actor.toLowerCase()}`;

export const routeCases: RouteCase[] = [
  { method: 'get', template: '/api/health', expected: { default: 200 } },
  { method: 'get', template: '/api/openapi.json', expected: { default: 200 } },
  { method: 'get', template: '/api/auth/session', expected: { default: 200 } },
  { method: 'get', template: '/api/auth/google', expected: { default: 302 } },
  { method: 'get', template: '/api/auth/sso', expected: { default: 302 } },
  { method: 'get', template: '/api/account/tokens', expected: signedInOnly },
  {
    method: 'post',
    template: '/api/account/tokens',
    body: (actor) => ({ name: `Script of ${actor}`, scope: 'read' }),
    expected: { signedOut: 401, default: 201 },
  },
  { method: 'delete', template: '/api/account/tokens/{tokenId}', expected: { signedOut: 401, tomas: 204, default: 404 } },
  { method: 'get', template: '/api/account/mail-preferences', expected: signedInOnly },
  {
    method: 'put',
    template: '/api/account/mail-preferences',
    body: () => ({ mail: { baseline_locked: true, study_promoted: true, row_changed: true } }),
    expected: signedInOnly,
  },
  { method: 'get', template: '/api/account/identities', expected: signedInOnly },
  { method: 'post', template: '/api/account/identities', body: () => ({ provider: 'google' }), expected: signedInOnly },
  { method: 'get', template: '/api/notifications', expected: signedInOnly },
  { method: 'post', template: '/api/notifications/read', body: () => ({}), expected: { signedOut: 401, default: 204 } },
  { method: 'get', template: '/api/templates', expected: signedInOnly },
  { method: 'get', template: '/api/crafts', expected: signedInOnly },
  { method: 'post', template: '/api/crafts', body: (actor) => ({ name: `Matrix craft by ${actor}` }), expected: adminsOnly(201, 201) },
  {
    method: 'post',
    template: '/api/crafts',
    body: (actor) => ({ name: `Copy by ${actor}`, copyOf: '{craftId}' }),
    expected: adminsOnly(201, 404),
  },
  { method: 'get', template: craft, expected: craftMembersOnly },
  {
    method: 'patch',
    template: craft,
    body: () => ({ description: 'Square-sail technology demonstrator on a 12U bus, four diagonal booms.' }),
    expected: { signedOut: 401, ines: 200, tomas: 200, priya: 404, default: 403 },
  },
  { method: 'get', template: `${craft}/members`, expected: craftMembersOnly },
  { method: 'get', template: `${craft}/revisions`, expected: craftMembersOnly },
  { method: 'get', template: revision, expected: craftMembersOnly },
  { method: 'get', template: `${revision}/evaluation`, expected: craftMembersOnly },
  { method: 'get', template: `${craft}/compare`, query: 'from={revisionId}&to={revisionId}&output=sail_area', expected: craftMembersOnly },
  {
    method: 'post',
    template: `${revision}/parameters`,
    body: (actor) => ({ parameter: { key: actorKey(actor), label: `Row of ${actor}`, subsystem: 'Spacecraft', unit: 'kg', value: 0.1 } }),
    expected: engineersOnly(201),
  },
  // The same value again: allowed writes change nothing. Sail side is shared with the partner, booms are Kenji's.
  {
    method: 'patch',
    template: `${revision}/parameters/{key}`,
    fill: () => ({ key: 'sail_side' }),
    body: () => ({ version: 2, value: 45 }),
    expected: engineersOnly(200),
  },
  {
    method: 'patch',
    template: `${revision}/parameters/{key}`,
    fill: () => ({ key: 'boom_count' }),
    body: () => ({ version: 1, value: 4 }),
    expected: { ...engineersOnly(200), kenji: 200, lucia: 404 },
  },
  // A stale version: those allowed to delete get 409 version_conflict, so nothing is deleted.
  {
    method: 'delete',
    template: `${revision}/parameters/{key}`,
    fill: () => ({ key: 'front_coating_thickness' }),
    query: 'version=999',
    expected: engineersOnly(409),
  },
  // In Kenji's study its owner and the engineers edit any row (sail side is not Kenji's subsystem); the same value again.
  {
    method: 'patch',
    template: `${revision}/parameters/{key}`,
    fill: (ids) => ({ revisionId: ids.studyId, key: 'sail_side' }),
    body: () => ({ version: 2, value: 45 }),
    expected: { ...engineersOnly(200), kenji: 200 },
  },
  // A locked baseline: nobody edits it (a chief engineer neither); partners see sail side, so it is 403 for them too.
  {
    method: 'patch',
    template: `${revision}/parameters/{key}`,
    fill: (ids) => ({ revisionId: ids.baselineId, key: 'sail_side' }),
    body: () => ({ version: 1, value: 41 }),
    expected: { signedOut: 401, priya: 404, default: 403 },
  },
  {
    method: 'post',
    template: `${revision}/lock`,
    body: (actor) => ({ label: `Matrix review by ${actor}` }),
    expected: { signedOut: 401, tomas: 201, priya: 404, default: 403 },
  },
  {
    method: 'post',
    template: `${revision}/studies`,
    body: (actor) => ({ name: `Matrix study by ${actor}` }),
    expected: { ...engineersOnly(201), kenji: 201 },
  },
  // The baseline is no study: the chief engineer, who may promote, gets 409 not_a_study, so nothing is promoted.
  {
    method: 'post',
    template: `${craft}/revisions/{studyId}/promote`,
    fill: (ids) => ({ studyId: ids.baselineId }),
    body: () => ({ resolutions: {} }),
    expected: { signedOut: 401, tomas: 409, priya: 404, default: 403 },
  },
  {
    method: 'get',
    template: `${craft}/revisions/{revisionId}/review.pdf`,
    fill: (ids) => ({ revisionId: ids.baselineId }),
    expected: { signedOut: 401, lucia: 403, priya: 404, default: 200 },
  },
  { method: 'get', template: `${craft}/allowance-table`, expected: craftMembersOnly },
  // The shipped AIAA-style cells under a table of the team's own: the budget rolls up as before for later rows.
  { method: 'put', template: `${craft}/allowance-table`, body: () => ({ table: teamTable }), expected: engineersOnly(200) },
  // A computation, not a write: everyone on the craft runs it (the partner on the rows shared with them: sail side is).
  {
    method: 'post',
    template: `${revision}/uncertainty`,
    body: () => ({ inputs: [{ key: 'sail_side', distribution: { kind: 'uniform', min: 40, max: 50 } }], samples: 200 }),
    expected: craftMembersOnly,
  },
  { method: 'get', template: `${revision}/export.xlsx`, expected: craftMembersOnly },
  { method: 'get', template: `${revision}/export.json`, fill: (ids) => ({ revisionId: ids.baselineId }), expected: craftMembersOnly },
  { method: 'get', template: `${revision}/export.csv`, expected: craftMembersOnly },
  // Without a file: whoever may import gets 400 file_missing; the right to import is checked before the upload is read.
  {
    method: 'post',
    template: `${revision}/imports`,
    expected: { signedOut: 401, ines: 403, oren: 403, priya: 404, default: 400 },
  },
  {
    method: 'post',
    template: `${craft}/imports/{importId}/accept`,
    fill: () => ({ importId: '00000000-0000-4000-8000-000000000000' }),
    body: () => ({}),
    expected: { signedOut: 401, ines: 403, oren: 403, priya: 404, default: 404 },
  },
  { method: 'get', template: `${revision}/history`, expected: craftMembersOnly },
  {
    method: 'get',
    template: `${revision}/history`,
    fill: (ids) => ({ revisionId: ids.baselineId }),
    query: 'key=sail_side',
    expected: craftMembersOnly,
  },
  // Evidence on rows. Membrane mass is in the subsystem shared with the partner; boom mass is Kenji's.
  {
    method: 'get',
    template: `${revision}/parameters/{key}/attachments`,
    fill: () => ({ key: 'membrane_mass' }),
    expected: craftMembersOnly,
  },
  {
    method: 'get',
    template: `${revision}/parameters/{key}/attachments`,
    fill: () => ({ key: 'boom_mass' }),
    expected: { ...craftMembersOnly, lucia: 404 },
  },
  // A JSON body carries no file: whoever may attach gets 400 file_missing (checked after access), so nothing is written.
  {
    method: 'post',
    template: `${revision}/parameters/{key}/attachments`,
    fill: () => ({ key: 'membrane_mass' }),
    body: () => ({ kind: 'datasheet' }),
    expected: { ...engineersOnly(400), lucia: 400 },
  },
  {
    method: 'post',
    template: `${revision}/parameters/{key}/attachments`,
    fill: () => ({ key: 'boom_mass' }),
    body: () => ({ kind: 'datasheet' }),
    expected: { ...engineersOnly(400), kenji: 400, lucia: 404 },
  },
  {
    method: 'post',
    template: `${revision}/parameters/{key}/attachments`,
    fill: (ids) => ({ revisionId: ids.baselineId, key: 'membrane_mass' }),
    body: () => ({ kind: 'datasheet' }),
    expected: { signedOut: 401, priya: 404, default: 403 },
  },
  // No such file: those who may remove evidence (or their own) get 404, the others 403 before it is looked up.
  {
    method: 'delete',
    template: `${revision}/parameters/{key}/attachments/{attachmentId}`,
    fill: () => ({ key: 'boom_mass', attachmentId: '00000000-0000-4000-8000-000000000000' }),
    expected: { ...engineersOnly(404), kenji: 404, lucia: 404 },
  },
  {
    method: 'get',
    template: `${craft}/attachments/{attachmentId}`,
    fill: () => ({ attachmentId: '00000000-0000-4000-8000-000000000000' }),
    expected: { signedOut: 401, default: 404 },
  },
  { method: 'get', template: `${craft}/audit`, expected: { signedOut: 401, ines: 200, tomas: 200, priya: 404, default: 403 } },
  {
    method: 'get',
    template: `${craft}/audit`,
    query: 'format=csv',
    expected: { signedOut: 401, ines: 200, tomas: 200, priya: 404, default: 403 },
  },
  { method: 'post', template: `${craft}/subsystems`, body: (actor) => ({ name: `Matrix ${actor}` }), expected: engineersOnly(201) },
  { method: 'patch', template: `${craft}/subsystems/{subsystemId}`, body: () => ({ name: 'Optics' }), expected: engineersOnly(200) },
  // Optics has rows: those allowed to delete it get 409 in_use.
  { method: 'delete', template: `${craft}/subsystems/{subsystemId}`, expected: engineersOnly(409) },
  { method: 'get', template: `${craft}/events`, expected: craftMembersOnly, stream: true },
  {
    method: 'put',
    template: `${craft}/members/{userId}`,
    fill: (ids) => ({ userId: ids.ines }),
    body: () => ({ role: 'viewer' }),
    expected: adminsOnly(200, 404),
  },
  { method: 'delete', template: `${craft}/members/{userId}`, fill: (ids) => ({ userId: ids.ines }), expected: adminsOnly(204, 404) },
  { method: 'get', template: '/api/organisation', expected: signedInOnly },
  {
    method: 'post',
    template: '/api/organisation/invitations',
    body: (actor) => ({ name: `Invitee of ${actor}`, email: `invitee-${actor.toLowerCase()}@corvid-sailworks.example` }),
    expected: adminsOnly(201, 201),
  },
  // No such invitation: admins get 404, as for another organisation's.
  {
    method: 'delete',
    template: '/api/organisation/invitations/{invitationId}',
    fill: () => ({ invitationId: '00000000-0000-4000-8000-000000000000' }),
    expected: adminsOnly(404, 404),
  },
  {
    method: 'put',
    template: '/api/organisation/people/{userId}/admin',
    fill: (ids) => ({ userId: ids.tomas }),
    body: () => ({ isOrgAdmin: false }),
    expected: adminsOnly(200, 404),
  },
  // Signed out, any path past the public ones is 401 before routing: which routes exist is not told to strangers.
  { method: 'get', template: '/api/no-such-route', expected: { signedOut: 401, default: 404 }, undocumented: true },
  // Last: signing out everywhere also ends the sessions the rows above use.
  { method: 'post', template: '/api/auth/sign-out', expected: { default: 204 }, endsSession: true },
  { method: 'post', template: '/api/auth/sign-out-everywhere', expected: { signedOut: 401, default: 204 }, endsSession: true },
];

/** The route's template with its `{name}` parameters (in the path and in a body's strings) replaced by ids. */
export function fillTemplate(text: string, route: Pick<RouteCase, 'fill'>, ids: Ids): string {
  const values: Record<string, string> = { ...ids, ...(route.fill?.(ids) ?? {}) };
  return text.replace(/\{(\w+)\}/g, (whole, name: string) => values[name] ?? whole);
}
