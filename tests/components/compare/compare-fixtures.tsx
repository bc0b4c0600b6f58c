import CraftCompareRoute from '@/app/(app)/crafts/[craftId]/compare';
import type { CompareResponse, MovedOutput } from '@/shared/schemas/compare';
import type { Revision } from '@/shared/schemas/revisions';
import { demoSession, demoUser, mockFetch, setupQueryClient, type Route } from '../helpers/api';
import { renderRoutes } from '../helpers/render';
import { craftFor, craftId, detailFor, revisionId as draftId } from '../sheet/sheet-fixtures';

export { craftId, draftId };

const rhea = { id: 'f4c1a2b3-5d6e-4f70-8a9b-0c1d2e3f4a5b', name: 'Rhea Calder' };

/** The craft's revisions (invented): an older and a newer baseline, the draft continued from the newer, a study. */
export const draft: Revision = { ...detailFor().revision, parentId: '5e6f7a8b-9c0d-4e1f-8a2b-3c4d5e6f7a8b' };
export const olderBaseline: Revision = {
  ...draft,
  id: '4d5e6f7a-8b9c-4d0e-9f1a-2b3c4d5e6f7a',
  kind: 'baseline',
  state: 'locked',
  parentId: null,
  label: 'SRR',
  lockedBy: rhea,
  lockedAt: '2026-10-01T10:00:00.000Z',
};
export const baseline: Revision = {
  ...olderBaseline,
  id: '5e6f7a8b-9c0d-4e1f-8a2b-3c4d5e6f7a8b',
  parentId: olderBaseline.id,
  label: 'PDR',
  lockedAt: '2026-11-15T10:00:00.000Z',
};
export const study: Revision = {
  ...draft,
  id: '6f7a8b9c-0d1e-4f2a-9b3c-4d5e6f7a8b9c',
  kind: 'study',
  parentId: draftId,
  label: 'Wider sail',
  createdBy: rhea,
};

/** The address of a compare request as the screen sends it. */
export function comparePath(from: string, to: string, output?: string): string {
  return `/api/crafts/${craftId}/compare?from=${from}&to=${to}${output === undefined ? '' : `&output=${output}`}`;
}

/**
 * PDR against the draft: the sail grew from 40 m to 50 m (area 1600 m² → 2500 m², +56.25 %), a payload
 * margin row came, the old harness went; the total mass rose by 2 kg; the boom length did not move.
 */
export const comparison: CompareResponse = {
  from: baseline,
  to: draft,
  header: [],
  rows: {
    added: [{ key: 'payload_margin', label: 'Payload margin', subsystem: 'Payload', unit: 'kg', value: 2 }],
    removed: [{ key: 'old_harness', label: 'Old harness', subsystem: 'Avionics', unit: 'kg', value: 1.5 }],
    changed: [
      {
        key: 'sail_side',
        label: 'Sail side',
        subsystem: 'Sail membrane',
        changes: [
          { field: 'value', from: 40, fromUnit: 'm', to: 50, toUnit: 'm' },
          { field: 'maturity', from: 'estimated', to: 'calculated' },
        ],
      },
    ],
  },
  outputs: [
    {
      key: 'sail_area',
      label: 'Sail area',
      subsystem: 'Sail membrane',
      unit: 'm^2',
      from: 1600,
      fromUnit: 'm^2',
      to: 2500,
      change: 900,
      changePercent: 56.25,
      dimensionChanged: false,
    },
    {
      key: 'boom_length',
      label: 'Boom length',
      subsystem: 'Booms',
      unit: 'm',
      from: 28.28,
      fromUnit: 'm',
      to: 28.28,
      change: 0,
      changePercent: 0,
      dimensionChanged: false,
    },
    {
      key: 'total_mass',
      label: 'Total mass',
      subsystem: 'Spacecraft',
      unit: 'kg',
      from: 10,
      fromUnit: 'kg',
      to: 12,
      change: 2,
      changePercent: 20,
      dimensionChanged: false,
    },
  ],
};

/**
 * What moved the total mass (+2 kg): three inputs, deliberately not in the order of their shares, whose shares
 * add up to 1.4 kg; the remaining 0.6 kg is the remainder, which includes the new payload margin row.
 */
export const movedTotalMass: MovedOutput = {
  key: 'total_mass',
  unit: 'kg',
  from: 10,
  to: 12,
  change: 2,
  inputs: [
    { key: 'boom_density', label: 'Boom linear density', subsystem: 'Booms', unit: 'g/m', from: 30, to: 33, share: 0.3 },
    { key: 'sail_side', label: 'Sail side', subsystem: 'Sail membrane', unit: 'm', from: 40, to: 50, share: 1.5 },
    { key: 'film_thickness', label: 'Film thickness', subsystem: 'Sail membrane', unit: 'um', from: 2.5, to: 2, share: -0.4 },
  ],
  otherChanges: [{ key: 'payload_margin', reason: 'new in "to"' }],
  remainder: 0.6,
};

/**
 * Renders the compare route at `/crafts/:craftId/compare` plus `search` (e.g. "?from=…"), answering the
 * craft, its revisions and PDR against the draft unless `routes` says otherwise.
 */
export function renderCompare(options: { search?: string; revisions?: Revision[]; routes?: Record<string, Route> } = {}) {
  const { search = '', revisions = [olderBaseline, baseline, draft, study], routes = {} } = options;
  const fetchMock = mockFetch({
    [`GET /api/crafts/${craftId}`]: { status: 200, body: craftFor('viewer') },
    [`GET /api/crafts/${craftId}/revisions`]: { status: 200, body: { revisions } },
    [`GET ${comparePath(baseline.id, draftId)}`]: { status: 200, body: comparison },
    'GET /api/auth/session': { status: 200, body: demoSession(demoUser) },
    ...routes,
  });
  const { wrapper } = setupQueryClient({ ...demoUser, isOrgAdmin: false });
  renderRoutes(
    { 'crafts/[craftId]/compare': CraftCompareRoute, 'crafts/[craftId]/index': () => null, 'crafts/index': () => null },
    `/crafts/${craftId}/compare${search}`,
    wrapper,
  );
  return fetchMock;
}

/** The GET requests sent so far to this address. */
export function gets(fetchMock: jest.Mock, path: string): number {
  return fetchMock.mock.calls.filter(([url, init]: [string, RequestInit | undefined]) => (init?.method ?? 'GET') === 'GET' && url === path)
    .length;
}
