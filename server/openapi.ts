import { OpenAPIRegistry, OpenApiGeneratorV31, type RouteConfig } from '@asteasolutions/zod-to-openapi';
import { z } from 'zod';
import { auditListSchema, auditQuerySchema } from '@/shared/schemas/audit';
import { rowHistoryQuerySchema, rowHistorySchema } from '@/shared/schemas/history';
import { apiErrorSchema } from '@/shared/schemas/common';
import {
  attachBodySchema,
  attachmentParamsSchema,
  attachmentSchema,
  rowAttachmentParamsSchema,
  rowAttachmentsSchema,
} from '@/shared/schemas/attachments';
import { compareQuerySchema, compareResponseSchema } from '@/shared/schemas/compare';
import { acceptImportBodySchema, importParamsSchema, importPreviewSchema } from '@/shared/schemas/exchange';
import { craftListSchema, craftParamsSchema, craftSchema, createCraftBodySchema, updateCraftBodySchema } from '@/shared/schemas/crafts';
import { memberListSchema, memberParamsSchema, memberSchema, setMemberBodySchema } from '@/shared/schemas/members';
import {
  invitationParamsSchema,
  invitationSchema,
  inviteBodySchema,
  organisationResponseSchema,
  personParamsSchema,
  personSchema,
  setOrgAdminBodySchema,
} from '@/shared/schemas/organisation';
import {
  createParameterBodySchema,
  deleteParameterQuerySchema,
  evaluationResponseSchema,
  lockBaselineBodySchema,
  openStudyBodySchema,
  parameterParamsSchema,
  promoteStudyBodySchema,
  promotionSchema,
  revisionDetailSchema,
  revisionListSchema,
  revisionParameterSchema,
  revisionParamsSchema,
  revisionSchema,
  sheetEventSchema,
  studyParamsSchema,
  subsystemBodySchema,
  subsystemParamsSchema,
  subsystemSchema,
  updateParameterBodySchema,
} from '@/shared/schemas/revisions';
import { linkedIdentityListSchema, linkIdentityBodySchema, linkIdentityStartSchema, sessionResponseSchema } from '@/shared/schemas/session';
import { markReadBodySchema, mailPreferencesSchema, notificationListSchema } from '@/shared/schemas/notifications';
import { sheetSchema } from '@/shared/schemas/sheet';
import { templateListSchema } from '@/shared/schemas/templates';
import { accessTokenListSchema, createdTokenSchema, createTokenBodySchema, tokenParamsSchema } from '@/shared/schemas/tokens';
import { uncertaintyRequestSchema, uncertaintyResultSchema } from '@/shared/schemas/uncertainty';
import { allowanceTableParamsSchema, allowanceTableResponseSchema, putAllowanceTableBodySchema } from '@/shared/schemas/allowance-tables';

type Method = RouteConfig['method'];

const MEDIA_XLSX = 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet';

/** One documented route: what it takes, what it answers, and the error statuses it can give. */
interface DocumentedRoute {
  method: Method;
  path: string;
  summary: string;
  params?: z.ZodObject;
  query?: z.ZodObject;
  body?: z.ZodType;
  /** The body's media type when it is not JSON (an upload: multipart/form-data). */
  bodyContentType?: string;
  ok: { status: number; schema?: z.ZodType; description?: string; contentType?: string };
  errors: number[];
  /** Reachable with a personal access token (Bearer) as well as a session. */
  token?: boolean;
}

const errorText: Record<number, string> = {
  400: 'Invalid input: `details` lists each problem with its path',
  401: 'Not signed in, or the access token is unknown or revoked',
  403: 'Not allowed for this person, role or token (the message says why)',
  404: 'Not found, or not visible to this person',
  409: 'Conflicts with the current state (version_conflict carries `details.current`)',
  410: 'Gone: the thing has expired (an import preview after 24 hours: import_expired)',
  413: 'The uploaded file is larger than the limit (file_too_large)',
  415: 'The uploaded file is of a type not accepted here, judged by its content (unsupported_file_type, file_type_mismatch)',
  502: 'The mail could not be sent',
  503: 'The database does not answer',
};

const craft = '/api/crafts/{craftId}';
const revision = `${craft}/revisions/{revisionId}`;

/** Every API route, old and new; a test checks that each route of the role matrix is here. */
export const documentedRoutes: DocumentedRoute[] = [
  {
    method: 'get',
    path: '/api/health',
    summary: 'Whether the server and its database answer',
    ok: { status: 200, schema: z.object({ status: z.literal('ok') }) },
    errors: [503],
  },
  {
    method: 'get',
    path: '/api/openapi.json',
    summary: 'This document',
    ok: { status: 200, description: 'The OpenAPI 3.1 document' },
    errors: [],
  },
  {
    method: 'get',
    path: '/api/auth/session',
    summary: 'Who is signed in, a CSRF token and the sign-in providers',
    ok: { status: 200, schema: sessionResponseSchema },
    errors: [403],
  },
  {
    method: 'get',
    path: '/api/auth/google',
    summary: 'Starts a Google sign-in (redirect)',
    ok: { status: 302, description: 'Redirect to the provider' },
    errors: [403],
  },
  {
    method: 'get',
    path: '/api/auth/google/callback',
    summary: 'Completes a Google sign-in (redirect)',
    ok: { status: 302, description: 'Redirect to /crafts or /sign-in?error=<code>' },
    errors: [403],
  },
  {
    method: 'get',
    path: '/api/auth/sso',
    summary: 'Starts a company SSO sign-in (redirect)',
    ok: { status: 302, description: 'Redirect to the provider' },
    errors: [403],
  },
  {
    method: 'get',
    path: '/api/auth/sso/callback',
    summary: 'Completes a company SSO sign-in (redirect)',
    ok: { status: 302, description: 'Redirect to /crafts or /sign-in?error=<code>' },
    errors: [403],
  },
  { method: 'post', path: '/api/auth/sign-out', summary: 'Ends this session', ok: { status: 204 }, errors: [403] },
  {
    method: 'post',
    path: '/api/auth/sign-out-everywhere',
    summary: 'Ends every session of the signed-in person',
    ok: { status: 204 },
    errors: [401, 403],
  },
  {
    method: 'get',
    path: '/api/account/tokens',
    summary: "The signed-in person's access tokens (never their secrets)",
    ok: { status: 200, schema: accessTokenListSchema },
    errors: [401, 403],
  },
  {
    method: 'post',
    path: '/api/account/tokens',
    summary: 'Creates an access token; the secret is shown this once',
    body: createTokenBodySchema,
    ok: { status: 201, schema: createdTokenSchema },
    errors: [400, 401, 403],
  },
  {
    method: 'delete',
    path: '/api/account/tokens/{tokenId}',
    summary: 'Revokes an access token',
    params: tokenParamsSchema,
    ok: { status: 204 },
    errors: [401, 403, 404],
  },
  {
    method: 'get',
    path: '/api/account/mail-preferences',
    summary: 'Which kinds of notification the signed-in person also receives by mail',
    ok: { status: 200, schema: mailPreferencesSchema },
    errors: [401, 403],
  },
  {
    method: 'put',
    path: '/api/account/mail-preferences',
    summary: 'Turns kinds of notification mail on or off',
    body: mailPreferencesSchema,
    ok: { status: 200, schema: mailPreferencesSchema },
    errors: [400, 401, 403],
  },
  {
    method: 'get',
    path: '/api/account/identities',
    summary: 'The ways the signed-in person signs in: their linked providers',
    ok: { status: 200, schema: linkedIdentityListSchema },
    errors: [401, 403],
  },
  {
    method: 'post',
    path: '/api/account/identities',
    summary:
      "Asks to link another provider's sign-in to the signed-in person: the browser then goes to `startUrl`, signs in at the provider, and its callback links that identity (never one linked to someone else) and returns to /account?link=<result>&provider=<provider>",
    body: linkIdentityBodySchema,
    ok: { status: 200, schema: linkIdentityStartSchema },
    errors: [400, 401, 403],
  },
  {
    method: 'get',
    path: '/api/notifications',
    summary: "The signed-in person's latest notifications, newest first, and how many are unread",
    ok: { status: 200, schema: notificationListSchema },
    errors: [401],
    token: true,
  },
  {
    method: 'post',
    path: '/api/notifications/read',
    summary: 'Marks the given notifications (or all of them) read',
    body: markReadBodySchema,
    ok: { status: 204 },
    errors: [400, 401],
    token: true,
  },
  {
    method: 'get',
    path: '/api/templates',
    summary: 'Templates a craft can start from',
    ok: { status: 200, schema: templateListSchema },
    errors: [401],
    token: true,
  },
  {
    method: 'get',
    path: '/api/crafts',
    summary: 'Crafts the person may see',
    ok: { status: 200, schema: craftListSchema },
    errors: [401],
    token: true,
  },
  {
    method: 'post',
    path: '/api/crafts',
    summary: "Creates a craft from a template or as a copy of another craft's sheet",
    body: createCraftBodySchema,
    ok: { status: 201, schema: craftSchema },
    errors: [400, 401, 403, 404],
    token: true,
  },
  {
    method: 'get',
    path: craft,
    summary: 'One craft',
    params: craftParamsSchema,
    ok: { status: 200, schema: craftSchema },
    errors: [401, 404],
    token: true,
  },
  {
    method: 'patch',
    path: craft,
    summary: "Changes a craft's name or description",
    params: craftParamsSchema,
    body: updateCraftBodySchema,
    ok: { status: 200, schema: craftSchema },
    errors: [400, 401, 403, 404],
    token: true,
  },
  {
    method: 'get',
    path: `${craft}/members`,
    summary: "The craft's members and roles",
    params: craftParamsSchema,
    ok: { status: 200, schema: memberListSchema },
    errors: [401, 404],
    token: true,
  },
  {
    method: 'put',
    path: `${craft}/members/{userId}`,
    summary: "Sets a person's role (and subsystems) on the craft",
    params: memberParamsSchema,
    body: setMemberBodySchema,
    ok: { status: 200, schema: memberSchema },
    errors: [400, 401, 403, 404, 409],
  },
  {
    method: 'delete',
    path: `${craft}/members/{userId}`,
    summary: 'Takes a person off the craft',
    params: memberParamsSchema,
    ok: { status: 204 },
    errors: [401, 403, 404, 409],
  },
  {
    method: 'get',
    path: `${craft}/revisions`,
    summary: "The craft's revisions",
    params: craftParamsSchema,
    ok: { status: 200, schema: revisionListSchema },
    errors: [401, 404],
    token: true,
  },
  {
    method: 'get',
    path: revision,
    summary: 'A revision and its sheet, each row with its version, and what the caller may do',
    params: revisionParamsSchema,
    ok: { status: 200, schema: revisionDetailSchema },
    errors: [401, 404],
    token: true,
  },
  {
    method: 'get',
    path: `${revision}/evaluation`,
    summary: 'The revision evaluated on the server (values, errors, mass budget)',
    params: revisionParamsSchema,
    ok: { status: 200, schema: evaluationResponseSchema },
    errors: [401, 404],
    token: true,
  },
  {
    method: 'get',
    path: `${craft}/compare`,
    summary:
      'Compares two revisions: rows added, removed and changed, every output old and new, and with `output` the changed inputs that moved it, each with its share',
    params: craftParamsSchema,
    query: compareQuerySchema,
    ok: { status: 200, schema: compareResponseSchema },
    errors: [400, 401, 404],
    token: true,
  },
  {
    method: 'post',
    path: `${revision}/lock`,
    summary: 'Locks the working draft as a baseline (label, note); the draft continues from it. Chief engineers',
    params: revisionParamsSchema,
    body: lockBaselineBodySchema,
    ok: { status: 201, schema: revisionSchema },
    errors: [400, 401, 403, 404, 409],
    token: true,
  },
  {
    method: 'post',
    path: `${revision}/studies`,
    summary: "Opens a study (a named branch the caller owns) from any revision, keeping the source's rows as the merge base",
    params: revisionParamsSchema,
    body: openStudyBodySchema,
    ok: { status: 201, schema: revisionSchema },
    errors: [400, 401, 403, 404],
    token: true,
  },
  {
    method: 'post',
    path: `${craft}/revisions/{studyId}/promote`,
    summary:
      'Promotes a study into the working draft by a row-by-row three-way merge; 409 merge_conflicts lists rows changed in both (`details.conflicts`) until each has a resolution. Chief engineers',
    params: studyParamsSchema,
    body: promoteStudyBodySchema,
    ok: { status: 200, schema: promotionSchema },
    errors: [400, 401, 403, 404, 409],
    token: true,
  },
  {
    method: 'get',
    path: `${revision}/review.pdf`,
    summary:
      'The design review pack of a revision as a PDF download: headline figures, mass budget table and chart, changes since the previous baseline. For readers of the whole sheet',
    params: revisionParamsSchema,
    ok: { status: 200, schema: z.string().meta({ format: 'binary' }), contentType: 'application/pdf' },
    errors: [401, 403, 404],
    token: true,
  },
  {
    method: 'get',
    path: `${revision}/export.xlsx`,
    summary:
      "The revision as a workbook download: a cover (craft, revision, who exported it and when, the caution), the Parameters sheet with live formulas over one defined name per key (computing in SI units), the mass budget with live allowance and predicted-mass formulas, and the allowance table. Whoever views the craft; partners get the rows shared with them",
    params: revisionParamsSchema,
    ok: { status: 200, schema: z.string().meta({ format: 'binary' }), contentType: MEDIA_XLSX },
    errors: [400, 401, 404],
    token: true,
  },
  {
    method: 'get',
    path: `${revision}/export.json`,
    summary: 'The revision as the sheet JSON (the documented sheet format `npm run evaluate` reads) download. Whoever views the craft; partners get the rows shared with them',
    params: revisionParamsSchema,
    ok: { status: 200, schema: sheetSchema },
    errors: [400, 401, 404],
    token: true,
  },
  {
    method: 'get',
    path: `${revision}/export.csv`,
    summary:
      "The revision's computed values as CSV (key, label, subsystem, value, unit, error); cells that start with = + - @ get a leading quote. Whoever views the craft; partners get the rows shared with them",
    params: revisionParamsSchema,
    ok: { status: 200, schema: z.string(), contentType: 'text/csv' },
    errors: [400, 401, 404],
    token: true,
  },
  {
    method: 'post',
    path: `${revision}/imports`,
    summary:
      'Reads a workbook in Trimsheet\'s layout (multipart `file`, an .xlsx of at most 8 MB, unpacking to at most 64 MB, at most 20,000 rows a sheet, no macros, no links to other files, only functions Trimsheet knows) against the revision and answers its preview: rows changed, added and removed, problems and ignored rows, each naming its cell. Nothing of the sheet is written. Partners, subsystem owners, systems and chief engineers; partners change only rows of the subsystems shared with them',
    params: revisionParamsSchema,
    body: z.object({ file: z.string().meta({ format: 'binary' }) }),
    bodyContentType: 'multipart/form-data',
    ok: { status: 201, schema: importPreviewSchema },
    errors: [400, 401, 403, 404, 413, 415],
    token: true,
  },
  {
    method: 'post',
    path: `${craft}/imports/{importId}/accept`,
    summary:
      "Accepts an import's preview: one transaction opens a study of the revision as it is now (owned by the importer) with the preview's changes. The importer only, once (409 already_accepted), within 24 hours (410 import_expired); 409 import_stale when a row it changes moved on since the preview",
    params: importParamsSchema,
    body: acceptImportBodySchema,
    ok: { status: 201, schema: revisionSchema },
    errors: [400, 401, 403, 404, 409, 410],
    token: true,
  },
  {
    method: 'get',
    path: `${craft}/allowance-table`,
    summary:
      "The craft's own allowance table (null while it has none): the growth allowance of each maturity and category and the required system margin, which the mass budget of every sheet of the craft reads in place of the preset the sheet names. Whoever views the craft",
    params: allowanceTableParamsSchema,
    ok: { status: 200, schema: allowanceTableResponseSchema },
    errors: [401, 404],
    token: true,
  },
  {
    method: 'put',
    path: `${craft}/allowance-table`,
    summary:
      "Saves the craft's own allowance table (systems and chief engineers). Every cell is an allowance fraction in [0, 1]; every maturity has a row with a cell for every category; the system margin is a percentage in [0, 100) of the allocation or of the predicted mass (`systemMarginBasis`). A 400 names each cell or field at fault",
    params: allowanceTableParamsSchema,
    body: putAllowanceTableBodySchema,
    ok: { status: 200, schema: allowanceTableResponseSchema },
    errors: [400, 401, 403, 404],
    token: true,
  },
  {
    method: 'post',
    path: `${revision}/uncertainty`,
    summary:
      'An uncertainty (Monte Carlo) study of the revision: inputs given a uniform, triangular or normal distribution, at most 100,000 samples from a seeded generator; percentiles, histograms and the probability of meeting each requirement (the sheet\'s own and those asked). Whoever views the craft; partners vary and read the rows shared with them',
    params: revisionParamsSchema,
    body: uncertaintyRequestSchema,
    ok: { status: 200, schema: uncertaintyResultSchema },
    // A POST: an access token needs the read-write scope (403 token_scope otherwise).
    errors: [400, 401, 403, 404],
    token: true,
  },
  {
    method: 'get',
    path: `${revision}/history`,
    summary:
      "A revision's row changes, newest first, at most 200 (`truncated` when there were more): who, when, the row before and after, and the revision it was made in (a baseline's are its draft's up to the lock; a study's start with its source's). `key` narrows to one row and its earlier keys; partners get the changes of rows they may see",
    params: revisionParamsSchema,
    query: rowHistoryQuerySchema,
    ok: { status: 200, schema: rowHistorySchema },
    errors: [400, 401, 404],
    token: true,
  },
  {
    method: 'get',
    path: `${craft}/audit`,
    summary:
      'The audit log (locks, studies, promotions, role changes, access tokens), newest first; `format=csv` or `Accept: text/csv` exports CSV. Organisation admins and chief engineers',
    params: craftParamsSchema,
    query: auditQuerySchema,
    ok: { status: 200, schema: auditListSchema },
    errors: [400, 401, 403, 404],
    token: true,
  },
  {
    method: 'post',
    path: `${revision}/parameters`,
    summary: 'Adds a row',
    params: revisionParamsSchema,
    body: createParameterBodySchema,
    ok: { status: 201, schema: revisionParameterSchema },
    errors: [400, 401, 403, 404, 409],
    token: true,
  },
  {
    method: 'patch',
    path: `${revision}/parameters/{key}`,
    summary: 'Changes, renames or moves a row read at `version`',
    params: parameterParamsSchema,
    body: updateParameterBodySchema,
    ok: { status: 200, schema: revisionParameterSchema },
    errors: [400, 401, 403, 404, 409],
    token: true,
  },
  {
    method: 'delete',
    path: `${revision}/parameters/{key}`,
    summary: 'Deletes a row read at `version`',
    params: parameterParamsSchema,
    query: deleteParameterQuerySchema,
    ok: { status: 204 },
    errors: [400, 401, 403, 404, 409],
    token: true,
  },
  {
    method: 'post',
    path: `${craft}/subsystems`,
    summary: 'Adds a subsystem',
    params: craftParamsSchema,
    body: subsystemBodySchema,
    ok: { status: 201, schema: subsystemSchema },
    errors: [400, 401, 403, 404, 409],
    token: true,
  },
  {
    method: 'patch',
    path: `${craft}/subsystems/{subsystemId}`,
    summary: 'Renames a subsystem',
    params: subsystemParamsSchema,
    body: subsystemBodySchema,
    ok: { status: 200, schema: subsystemSchema },
    errors: [400, 401, 403, 404, 409],
    token: true,
  },
  {
    method: 'delete',
    path: `${craft}/subsystems/{subsystemId}`,
    summary: 'Deletes a subsystem no row uses',
    params: subsystemParamsSchema,
    ok: { status: 204 },
    errors: [401, 403, 404, 409],
    token: true,
  },
  {
    method: 'get',
    path: `${craft}/events`,
    summary: "Server-sent events of the craft's sheet changes: each `data:` line is a SheetEvent",
    params: craftParamsSchema,
    ok: { status: 200, schema: sheetEventSchema, contentType: 'text/event-stream' },
    errors: [401, 404],
    token: true,
  },
  {
    method: 'get',
    path: `${revision}/parameters/{key}/attachments`,
    summary:
      "A row's evidence (datasheets, weighing and test reports), newest first, without the bytes: name, sniffed type, size, kind, who and when, whether the caller may remove each, and `attachRefusal` when the caller may not attach. Whoever may view the row",
    params: parameterParamsSchema,
    ok: { status: 200, schema: rowAttachmentsSchema },
    errors: [400, 401, 404],
    token: true,
  },
  {
    method: 'post',
    path: `${revision}/parameters/{key}/attachments`,
    summary:
      'Attaches a file to a row (multipart: `file` and `kind`), at most 10 MB; PDF, PNG, JPEG, .xlsx, .ods or plain text (CSV included), the type judged by the content. Whoever may edit the row, and partners on rows shared with them; never in a locked revision',
    params: parameterParamsSchema,
    body: attachBodySchema.extend({ file: z.string().meta({ format: 'binary' }) }),
    bodyContentType: 'multipart/form-data',
    ok: { status: 201, schema: attachmentSchema },
    errors: [400, 401, 403, 404, 413, 415],
    token: true,
  },
  {
    method: 'delete',
    path: `${revision}/parameters/{key}/attachments/{attachmentId}`,
    summary:
      'Removes a file from a row (copies of the revision keep theirs). Whoever attached it, the owner of the subsystem, systems and chief engineers; 409 evidence_required for the last weighing report of a measured row',
    params: rowAttachmentParamsSchema,
    ok: { status: 204, description: 'Removed' },
    errors: [400, 401, 403, 404, 409],
    token: true,
  },
  {
    method: 'get',
    path: `${craft}/attachments/{attachmentId}`,
    summary:
      'Downloads an attached file (Content-Disposition: attachment, X-Content-Type-Options: nosniff, the type sniffed at upload). Whoever may view a row it is attached to',
    params: attachmentParamsSchema,
    ok: { status: 200, schema: z.string().meta({ format: 'binary' }), contentType: 'application/octet-stream' },
    errors: [400, 401, 404],
    token: true,
  },
  {
    method: 'get',
    path: '/api/organisation',
    summary: "The person's organisation and its people",
    ok: { status: 200, schema: organisationResponseSchema },
    errors: [401],
    token: true,
  },
  {
    method: 'post',
    path: '/api/organisation/invitations',
    summary:
      'Invites a person by e-mail (at most 254 characters), for either sign-in or one provider (which may also link that provider for someone already in the organisation); organisation admins, at most 20 an hour each and 60 an hour per organisation (429 rate_limited)',
    body: inviteBodySchema,
    ok: { status: 201, schema: invitationSchema },
    errors: [400, 401, 403, 409, 429, 502],
  },
  {
    method: 'delete',
    path: '/api/organisation/invitations/{invitationId}',
    summary: 'Withdraws a pending invitation, which can then no longer be accepted; 409 invitation_accepted once accepted',
    params: invitationParamsSchema,
    ok: { status: 204, description: 'Withdrawn' },
    errors: [400, 401, 403, 404, 409],
  },
  {
    method: 'put',
    path: '/api/organisation/people/{userId}/admin',
    summary: 'Grants or withdraws organisation admin rights',
    params: personParamsSchema,
    body: setOrgAdminBodySchema,
    ok: { status: 200, schema: personSchema },
    errors: [400, 401, 403, 404, 409],
  },
];

/** The OpenAPI 3.1 document of the API, generated from the shared zod schemas. */
export function openApiDocument() {
  const registry = new OpenAPIRegistry();
  registry.registerComponent('securitySchemes', 'session', { type: 'apiKey', in: 'cookie', name: 'trimsheet.sid' });
  registry.registerComponent('securitySchemes', 'accessToken', { type: 'http', scheme: 'bearer', description: 'A personal access token' });
  for (const route of documentedRoutes) {
    const json = (schema: z.ZodType, contentType = 'application/json') => ({ content: { [contentType]: { schema } } });
    registry.registerPath({
      method: route.method,
      path: route.path,
      summary: route.summary,
      security: route.token ? [{ session: [] }, { accessToken: [] }] : [{ session: [] }],
      request: {
        ...(route.params ? { params: route.params } : {}),
        ...(route.query ? { query: route.query } : {}),
        ...(route.body ? { body: json(route.body, route.bodyContentType) } : {}),
      },
      responses: {
        [route.ok.status]: {
          description: route.ok.description ?? 'Success',
          ...(route.ok.schema ? json(route.ok.schema, route.ok.contentType) : {}),
        },
        ...Object.fromEntries(
          route.errors.map((status) => [status, { description: errorText[status] ?? 'Error', ...json(apiErrorSchema) }]),
        ),
      },
    });
  }
  return new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: '3.1.0',
    info: {
      title: 'Trimsheet API',
      version: '1',
      description:
        'Solar-sail sizing sheets, their revisions and who may change what. Browsers use the session cookie and send the CSRF token in `x-csrf-token` on writes; scripts send `Authorization: Bearer <token>` and need no CSRF token.',
    },
  });
}
