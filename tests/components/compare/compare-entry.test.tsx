import { fireEvent, screen } from '@testing-library/dom';
import CraftCompareRoute from '@/app/(app)/crafts/[craftId]/compare';
import { CraftScreen } from '@/components/crafts/craft-screen';
import { demoSession, demoUser, mockFetch, setupQueryClient } from '../helpers/api';
import { renderRoutes } from '../helpers/render';
import { craftFor } from '../sheet/sheet-fixtures';
import { baseline, comparePath, comparison, craftId, draft, draftId, study } from './compare-fixtures';

describe('Compare revisions on the craft screen', () => {
  it('opens the comparison of the latest baseline with the working draft', async () => {
    mockFetch({
      [`GET /api/crafts/${craftId}`]: { status: 200, body: craftFor('viewer') },
      [`GET /api/crafts/${craftId}/members`]: { status: 200, body: { members: [] } },
      [`GET /api/crafts/${craftId}/revisions`]: { status: 200, body: { revisions: [baseline, draft, study] } },
      [`GET ${comparePath(baseline.id, draftId)}`]: { status: 200, body: comparison },
      'GET /api/auth/session': { status: 200, body: demoSession(demoUser) },
    });
    const { wrapper } = setupQueryClient({ ...demoUser, isOrgAdmin: false });
    renderRoutes(
      {
        'crafts/[craftId]/index': () => <CraftScreen craftId={craftId} />,
        'crafts/[craftId]/compare': CraftCompareRoute,
        'crafts/index': () => null,
      },
      `/crafts/${craftId}`,
      wrapper,
    );
    const link = await screen.findByTestId('craft-open-compare');
    expect(link.getAttribute('href')).toBe(`/crafts/${craftId}/compare`);
    fireEvent.click(link);
    expect(await screen.findByTestId('compare-output-sail_area')).toBeTruthy();
  });
});
