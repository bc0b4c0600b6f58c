import { fireEvent, screen, waitFor, within } from '@testing-library/dom';
import { Linking } from 'react-native';
import { apiUrl } from '@/components/api/client';
import { RevisionsScreen } from '@/components/revisions/revisions-screen';
import type { AuditEvent } from '@/shared/schemas/audit';
import type { CraftRole } from '@/shared/schemas/roles';
import { demoSession, demoUser, mockFetch, setupQueryClient, type Route } from '../helpers/api';
import { renderRoutes } from '../helpers/render';
import { baseline, draft, study } from '../compare/compare-fixtures';
import { craftFor, craftId, requests } from '../sheet/sheet-fixtures';

const auditPath = `/api/crafts/${craftId}/audit`;
const tomas = { id: '2b3c4d5e-6f70-4a81-9b2c-3d4e5f6a7b8c', name: 'Tomás Reyes' };

const locked: AuditEvent = {
  id: '11111111-2222-4333-8444-555555555555',
  at: '2026-11-15T10:00:42.000Z',
  action: 'baseline_locked',
  actor: tomas,
  craftId,
  subject: 'PDR',
  details: {},
};
const opened: AuditEvent = {
  ...locked,
  id: '11111111-2222-4333-8444-666666666666',
  at: '2026-11-18T09:30:00.000Z',
  action: 'study_opened',
  actor: null,
  subject: 'Lighter deployer hinge',
};

function renderRevisions(role: CraftRole, routes: Record<string, Route>) {
  const fetchMock = mockFetch({
    [`GET /api/crafts/${craftId}`]: { status: 200, body: craftFor(role) },
    [`GET /api/crafts/${craftId}/revisions`]: { status: 200, body: { revisions: [baseline, draft, study] } },
    'GET /api/auth/session': { status: 200, body: demoSession(demoUser) },
    ...routes,
  });
  const { wrapper } = setupQueryClient({ ...demoUser, isOrgAdmin: false });
  renderRoutes(
    { 'crafts/[craftId]/revisions': () => <RevisionsScreen craftId={craftId} />, 'crafts/[craftId]/index': () => null },
    `/crafts/${craftId}/revisions`,
    wrapper,
  );
  return fetchMock;
}

describe('the audit log on the Revisions screen', () => {
  afterEach(() => jest.restoreAllMocks());

  it('lists a chief engineer the entries newest first: what, to what, who and when', async () => {
    renderRevisions('chief_engineer', { [`GET ${auditPath}`]: { status: 200, body: { events: [opened, locked] } } });
    const log = await screen.findByTestId('audit-log');
    const entries = await within(log).findAllByTestId('audit-entry');
    expect(entries.map((entry) => entry.textContent)).toEqual([
      'Study opened: Lighter deployer hingeA former member · 2026-11-18 09:30 UTC',
      'Baseline locked: PDRTomás Reyes · 2026-11-15 10:00 UTC',
    ]);
  });

  it('filters by kind of entry, asking the server for that kind only', async () => {
    const fetchMock = renderRevisions('chief_engineer', {
      [`GET ${auditPath}`]: { status: 200, body: { events: [opened, locked] } },
      [`GET ${auditPath}?action=baseline_locked`]: { status: 200, body: { events: [locked] } },
    });
    const filter = await screen.findByTestId('audit-filter');
    fireEvent.click(within(filter).getByRole('radio', { name: 'Baseline locked' }));
    await waitFor(() =>
      expect(screen.getAllByTestId('audit-entry').map((entry) => entry.textContent)).toEqual([expect.stringContaining('PDR')]),
    );
    expect(requests(fetchMock, 'GET', `${auditPath}?action=baseline_locked`)).toHaveLength(1);
  });

  it('exports the filtered log as CSV through the browser', async () => {
    const openURL = jest.spyOn(Linking, 'openURL').mockResolvedValue(true);
    renderRevisions('chief_engineer', {
      [`GET ${auditPath}`]: { status: 200, body: { events: [locked] } },
      [`GET ${auditPath}?action=study_opened`]: { status: 200, body: { events: [] } },
    });
    fireEvent.click(await screen.findByTestId('audit-export'));
    expect(openURL).toHaveBeenLastCalledWith(apiUrl(`${auditPath}?format=csv`));
    fireEvent.click(within(screen.getByTestId('audit-filter')).getByRole('radio', { name: 'Study opened' }));
    expect(await within(screen.getByTestId('audit-log')).findByText('No entry of this kind yet.')).toBeTruthy();
    fireEvent.click(screen.getByTestId('audit-export'));
    expect(openURL).toHaveBeenLastCalledWith(apiUrl(`${auditPath}?action=study_opened&format=csv`));
  });

  it('is not offered to those who may not read it, and asks nothing of the server for them', async () => {
    const fetchMock = renderRevisions('systems_engineer', {});
    await screen.findByTestId(`revision-${baseline.id}`);
    expect(screen.queryByTestId('audit-log')).toBeNull();
    expect(requests(fetchMock, 'GET', auditPath)).toEqual([]);
  });

  it('says so when the log cannot be loaded', async () => {
    renderRevisions('chief_engineer', {
      [`GET ${auditPath}`]: { status: 500, body: { error: { code: 'internal', message: 'The server is down' } } },
    });
    expect((await within(await screen.findByTestId('audit-log')).findByText('Could not load the audit log')).textContent).toBeTruthy();
  });
});
