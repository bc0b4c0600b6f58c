import { SheetScreen } from '@/components/sheet/sheet-screen';
import type { Craft } from '@/shared/schemas/crafts';
import type { RevisionAbilities, RevisionDetail, RevisionParameter } from '@/shared/schemas/revisions';
import type { CraftRole } from '@/shared/schemas/roles';
import type { Sheet } from '@/shared/schemas/sheet';
import { squareSailTemplate } from '@/shared/templates';
import { demoSession, demoUser, mockFetch, setupQueryClient, type Route } from '../helpers/api';
import { renderRoutes } from '../helpers/render';

/** Invented ids for the test craft, its draft and its subsystems. */
export const craftId = '3c2b1a09-8f7e-4d6c-9b5a-4f3e2d1c0b9a';
export const revisionId = '7d6c5b4a-3f2e-4d1c-8b0a-9f8e7d6c5b4a';
const subsystemIds: Record<string, string> = {};

/** A stable UUID per subsystem name. */
export function subsystemId(name: string): string {
  subsystemIds[name] ??= `00000000-0000-4000-8000-${String(Object.keys(subsystemIds).length + 1).padStart(12, '0')}`;
  return subsystemIds[name];
}

export const revisionPath = `/api/crafts/${craftId}/revisions/${revisionId}`;

/** The craft as GET /api/crafts/:craftId answers for a person with this role. */
export function craftFor(myRole: CraftRole | null): Craft {
  return {
    id: craftId,
    organisationId: demoUser.organisation.id,
    name: 'Kite-1 pathfinder',
    description: 'Demo craft',
    myRole,
    templateId: 'square-sail',
    draftRevisionId: revisionId,
    createdAt: '2026-11-02T09:00:00.000Z',
    updatedAt: '2026-11-20T16:30:00.000Z',
  };
}

const engineer: RevisionAbilities = { editableSubsystemIds: [], manageRows: true, manageSubsystems: true, wholeSheet: true };

/** The draft revision of a sheet (the square-sail template unless given), every row at version 1. */
export function detailFor(abilities: Partial<RevisionAbilities> = {}, sheet: Sheet = squareSailTemplate()): RevisionDetail {
  const names = [...new Set(sheet.parameters.map((parameter) => parameter.subsystem))];
  return {
    revision: {
      id: revisionId,
      craftId,
      kind: 'draft',
      state: 'open',
      parentId: null,
      label: 'Working draft',
      note: '',
      createdBy: null,
      createdAt: '2026-11-02T09:00:00.000Z',
      lockedBy: null,
      lockedAt: null,
      updatedAt: '2026-11-20T16:30:00.000Z',
    },
    sheet: {
      name: sheet.name,
      budget: sheet.budget,
      parameters: sheet.parameters.map((parameter) => ({
        ...parameter,
        subsystemId: subsystemId(parameter.subsystem),
        version: 1,
        updatedBy: null,
        updatedAt: '2026-11-20T16:30:00.000Z',
      })),
    },
    subsystems: names.map((name, position) => ({ id: subsystemId(name), name, position })),
    abilities: { ...engineer, editableSubsystemIds: names.map(subsystemId), ...abilities },
  };
}

/** Makes the window this wide, as react-native-web measures it (jsdom has no layout). */
export function setWindowWidth(width: number): void {
  Object.defineProperty(document.documentElement, 'clientWidth', { value: width, configurable: true });
  Object.defineProperty(document.documentElement, 'clientHeight', { value: 900, configurable: true });
  window.dispatchEvent(new Event('resize'));
}

/**
 * A stand-in for the server's copy of the revision: GET answers it, PATCH of a value applies it at the row's
 * version (409 version_conflict with the row now when the version is stale), and `othersSet` changes a row as
 * another person would.
 */
export class FakeRevision {
  constructor(public detail: RevisionDetail) {}

  row(key: string): RevisionParameter {
    const row = this.detail.sheet.parameters.find((candidate) => candidate.key === key);
    if (row === undefined) throw new Error(`no row ${key}`);
    return row;
  }

  othersSet(key: string, value: number, by: string): void {
    this.replace({
      ...this.row(key),
      value,
      version: this.row(key).version + 1,
      updatedBy: { id: 'f4c1a2b3-5d6e-4f70-8a9b-0c1d2e3f4a5b', name: by },
    });
  }

  private replace(row: RevisionParameter): void {
    this.detail = {
      ...this.detail,
      sheet: {
        ...this.detail.sheet,
        parameters: this.detail.sheet.parameters.map((candidate) => (candidate.key === row.key ? row : candidate)),
      },
    };
  }

  /** The routes of this revision: GET, and PATCH of each row's value. */
  routes(): Record<string, Route> {
    const routes: Record<string, Route> = { [`GET ${revisionPath}`]: () => ({ status: 200, body: this.detail }) };
    for (const { key } of this.detail.sheet.parameters) {
      routes[`PATCH ${revisionPath}/parameters/${key}`] = (body) => {
        const { version, value } = body as { version: number; value?: number };
        const row = this.row(key);
        if (version !== row.version) {
          return {
            status: 409,
            body: { error: { code: 'version_conflict', message: 'The row changed since you read it', details: { current: row } } },
          };
        }
        const saved = { ...row, ...(value === undefined ? {} : { value }), version: row.version + 1 };
        this.replace(saved);
        return { status: 200, body: saved };
      };
    }
    return routes;
  }
}

/** Renders the Sheet screen for a person with this role, answering the craft and revision from the given detail. */
export function renderSheet(options: { role?: CraftRole; detail?: RevisionDetail; routes?: Record<string, Route> } = {}) {
  const { role = 'systems_engineer', detail = detailFor(), routes = {} } = options;
  const server = new FakeRevision(detail);
  const fetchMock = mockFetch({
    [`GET /api/crafts/${craftId}`]: { status: 200, body: craftFor(role) },
    ...server.routes(),
    'GET /api/auth/session': { status: 200, body: demoSession(demoUser) },
    ...routes,
  });
  const { wrapper, queryClient } = setupQueryClient({ ...demoUser, isOrgAdmin: false });
  renderRoutes(
    { 'crafts/[craftId]/sheet': () => <SheetScreen craftId={craftId} />, 'crafts/[craftId]/index': () => null, 'crafts/index': () => null },
    `/crafts/${craftId}/sheet`,
    wrapper,
  );
  return { fetchMock, queryClient, server };
}

/** The requests sent so far with this method and path, with their parsed bodies. */
export function requests(fetchMock: jest.Mock, method: string, path: string): unknown[] {
  return fetchMock.mock.calls
    .filter(([url, init]: [string, RequestInit | undefined]) => (init?.method ?? 'GET') === method && url === path)
    .map(([, init]: [string, RequestInit | undefined]) => (typeof init?.body === 'string' ? JSON.parse(init.body) : undefined));
}
