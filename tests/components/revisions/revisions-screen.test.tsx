import { fireEvent, screen, waitFor, within } from '@testing-library/dom';
import { RevisionsScreen } from '@/components/revisions/revisions-screen';
import type { CraftRole } from '@/shared/schemas/roles';
import { squareSailTemplate } from '@/shared/templates';
import { demoSession, demoUser, mockFetch, setupQueryClient, type Route } from '../helpers/api';
import { renderRoutes } from '../helpers/render';
import { baseline, draft, draftId, study } from '../compare/compare-fixtures';
import { craftFor, craftId, requests, subsystemId } from '../sheet/sheet-fixtures';

const revisionsPath = `/api/crafts/${craftId}/revisions`;
function renderRevisions(role: CraftRole, routes: Record<string, Route> = {}) {
  const fetchMock = mockFetch({
    [`GET /api/crafts/${craftId}`]: { status: 200, body: craftFor(role) },
    [`GET ${revisionsPath}`]: { status: 200, body: { revisions: [baseline, draft, study] } },
    'GET /api/auth/session': { status: 200, body: demoSession(demoUser) },
    ...routes,
  });
  const { wrapper } = setupQueryClient({ ...demoUser, isOrgAdmin: false });
  renderRoutes(
    {
      'crafts/[craftId]/revisions': () => <RevisionsScreen craftId={craftId} />,
      'crafts/[craftId]/sheet': () => <div data-testid="sheet-route" />,
      'crafts/[craftId]/index': () => null,
    },
    `/crafts/${craftId}/revisions`,
    wrapper,
  );
  return fetchMock;
}

function type(testID: string, value: string) {
  fireEvent.change(screen.getByTestId(testID), { target: { value } });
}

describe('RevisionsScreen', () => {
  it('lets a chief engineer lock the draft as a baseline under a label', async () => {
    const fetchMock = renderRevisions('chief_engineer', {
      [`POST ${revisionsPath}/${draftId}/lock`]: { status: 201, body: { ...baseline, label: 'PDR' } },
    });
    fireEvent.click(await screen.findByTestId('revision-lock'));
    type('lock-label', 'PDR');
    type('lock-note', 'Sail grown to 45 m.');
    fireEvent.click(screen.getByTestId('lock-submit'));
    await waitFor(() =>
      expect(requests(fetchMock, 'POST', `${revisionsPath}/${draftId}/lock`)).toEqual([{ label: 'PDR', note: 'Sail grown to 45 m.' }]),
    );
  });

  it('shows the baselines with who locked them, their review pack and a compare with the draft', async () => {
    renderRevisions('viewer');
    const card = await screen.findByTestId(`revision-${baseline.id}`);
    expect(card.textContent).toContain('Locked by Rhea Calder on 2026-11-15 10:00 UTC');
    expect(within(card).getByTestId(`revision-pack-${baseline.id}`)).toBeTruthy();
    expect(within(card).getByTestId(`revision-compare-${baseline.id}`).getAttribute('href')).toBe(
      `/crafts/${craftId}/compare?from=${baseline.id}&to=${draftId}`,
    );
    // A viewer reads: no lock, no study, no promotion.
    expect(screen.queryByTestId('revision-lock')).toBeNull();
    expect(screen.queryByTestId(`revision-study-${draftId}`)).toBeNull();
    expect(screen.queryByTestId(`revision-promote-${study.id}`)).toBeNull();
  });

  it('opens a study from a baseline and goes to its sheet', async () => {
    const fetchMock = renderRevisions('systems_engineer', {
      [`POST ${revisionsPath}/${baseline.id}/studies`]: {
        status: 201,
        body: { ...study, id: '7a8b9c0d-1e2f-4a3b-8c4d-5e6f7a8b9c0d', parentId: baseline.id, label: 'Thinner film' },
      },
    });
    expect(screen.queryByTestId('revision-lock')).toBeNull();
    fireEvent.click(await screen.findByTestId(`revision-study-${baseline.id}`));
    type('study-name', 'Thinner film');
    fireEvent.click(screen.getByTestId('study-submit'));
    await waitFor(() =>
      expect(requests(fetchMock, 'POST', `${revisionsPath}/${baseline.id}/studies`)).toEqual([{ name: 'Thinner film', note: '' }]),
    );
    expect(await screen.findByTestId('sheet-route')).toBeTruthy();
  });

  it('promotes a study after the chief engineer resolves each conflict, sending the choices', async () => {
    const template = squareSailTemplate();
    const side = template.parameters.find((parameter) => parameter.key === 'sail_side');
    if (side === undefined) throw new Error('the template has a sail side');
    const row = (value: number) => ({ ...side, value, subsystemId: subsystemId(side.subsystem) });
    let attempt = 0;
    const fetchMock = renderRevisions('chief_engineer', {
      [`POST ${revisionsPath}/${study.id}/promote`]: () => {
        attempt += 1;
        return attempt === 1
          ? {
              status: 409,
              body: {
                error: {
                  code: 'merge_conflicts',
                  message: '1 row changed in both the draft and the study',
                  details: { conflicts: [{ key: 'sail_side', base: row(40), draft: row(42), study: row(45) }], unresolved: ['sail_side'] },
                },
              },
            }
          : { status: 200, body: { study: { ...study, state: 'locked' }, draft, applied: [{ key: 'sail_side', action: 'update' }] } };
      },
    });
    fireEvent.click(await screen.findByTestId(`revision-promote-${study.id}`));
    fireEvent.click(screen.getByTestId('promote-submit'));
    const conflict = await screen.findByTestId('promote-conflict-sail_side');
    expect(conflict.textContent).toContain('40 m');
    expect(conflict.textContent).toContain('42 m');
    expect(conflict.textContent).toContain('45 m');
    expect(screen.getByTestId('promote-submit').getAttribute('aria-disabled')).toBe('true');
    fireEvent.click(within(conflict).getByRole('radio', { name: "Take the study's" }));
    fireEvent.click(screen.getByTestId('promote-submit'));
    expect((await screen.findByTestId('promote-done')).textContent).toContain('1 row of the draft changed');
    expect(requests(fetchMock, 'POST', `${revisionsPath}/${study.id}/promote`)).toEqual([
      { resolutions: {} },
      { resolutions: { sail_side: 'study' } },
    ]);
  });
});
