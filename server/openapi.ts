import { OpenAPIRegistry, OpenApiGeneratorV31, type RouteConfig } from '@asteasolutions/zod-to-openapi';
import { z } from 'zod';
import { auditListSchema, auditQuerySchema } from '@/shared/schemas/audit';
import { rowHistoryQuerySchema, rowHistorySchema } from '@/shared/schemas/history';
import { apiErrorSchema } from '@/shared/schemas/common';
import { compareQuerySchema, compareResponseSchema } from '@/shared/schemas/compare';
import { craftListSchema, craftParamsSchema, craftSchema, createCraftBodySchema, updateCraftBodySchema } from '@/shared/schemas/crafts';
import { memberListSchema, memberParamsSchema, memberSchema, setMemberBodySchema } from '@/shared/schemas/members';
import {
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
import { sessionResponseSchema } from '@/shared/schemas/session';
import { markReadBodySchema, mailPreferencesSchema, notificationListSchema } from '@/shared/schemas/notifications';
import { templateListSchema } from '@/shared/schemas/templates';
import { accessTokenListSchema, createdTokenSchema, createTokenBodySchema, tokenParamsSchema } from '@/shared/schemas/tokens';

type Method = RouteConfig['method'];

/** One documented route: what it takes, what it answers, and the error statuses it can give. */
interface DocumentedRoute {
  method: Method;
  path: string;
  summary: string;
  params?: z.ZodObject;
  query?: z.ZodObject;
  body?: z.ZodType;
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
    path: '/api/organisation',
    summary: "The person's organisation and its people",
    ok: { status: 200, schema: organisationResponseSchema },
    errors: [401],
    token: true,
  },
  {
    method: 'post',
    path: '/api/organisation/invitations',
    summary: 'Invites a person by e-mail',
    body: inviteBodySchema,
    ok: { status: 201, schema: invitationSchema },
    errors: [400, 401, 403, 409, 502],
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
        ...(route.body ? { body: json(route.body) } : {}),
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
