import { fireEvent, screen, waitFor, within } from '@testing-library/dom';
import { CraftListScreen } from '@/components/crafts/craft-list-screen';
import type { Craft } from '@/shared/schemas/crafts';
import { demoUser, mockFetch, setupQueryClient } from '../helpers/api';
import { renderRoutes } from '../helpers/render';

const craft: Craft = {
  id: '3c2b1a09-8f7e-4d6c-9b5a-4f3e2d1c0b9a',
  organisationId: demoUser.organisation.id,
  name: 'Kite-1 pathfinder',
  description: 'Demo craft for the tests',
  myRole: 'subsystem_owner',
  templateId: 'square-sail',
  draftRevisionId: null,
  createdAt: '2026-11-02T09:00:00.000Z',
  updatedAt: '2026-11-20T16:30:00.000Z',
};

function renderList(user = demoUser) {
  const { wrapper } = setupQueryClient(user);
  renderRoutes({ 'crafts/index': CraftListScreen, 'crafts/[craftId]/index': () => null }, '/crafts', wrapper);
}

describe('CraftListScreen', () => {
  it('says it is loading while the crafts are on their way', () => {
    mockFetch({ 'GET /api/crafts': 'pending' });
    renderList();
    expect(screen.getByRole('heading', { name: 'Crafts' })).toBeTruthy();
    expect(within(screen.getByTestId('craft-list')).getByText('Loading crafts…')).toBeTruthy();
  });

  it('says so when there are no crafts, and points a member to an admin', async () => {
    mockFetch({ 'GET /api/crafts': { status: 200, body: { crafts: [] } } });
    renderList({ ...demoUser, isOrgAdmin: false });
    await screen.findByText('No crafts yet');
    expect(screen.getByText('An organisation admin can add you to a craft.')).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'New craft' })).toBeNull();
  });

  it('shows the server message when the crafts cannot be loaded, and tries again on request', async () => {
    const fetchMock = mockFetch({
      'GET /api/crafts': { status: 500, body: { error: { code: 'internal', message: 'Database unavailable' } } },
    });
    renderList();
    await screen.findByText('Could not load the crafts');
    expect(screen.getByText('Database unavailable')).toBeTruthy();

    fireEvent.click(screen.getByRole('button', { name: 'Try again' }));
    await waitFor(() => expect(fetchMock).toHaveBeenCalledTimes(2));
  });

  it('lists each craft with its name, description and the caller’s role, linking to the craft', async () => {
    mockFetch({
      'GET /api/crafts': {
        status: 200,
        body: {
          crafts: [
            craft,
            { ...craft, id: '7d6c5b4a-3e2f-4a1b-8c9d-0e1f2a3b4c5d', name: 'Heliopause scout', description: '', myRole: null },
          ],
        },
      },
    });
    renderList();
    const list = screen.getByTestId('craft-list');
    const card = await within(list).findByTestId(`craft-card-${craft.id}`);
    expect(within(card).getByText('Kite-1 pathfinder')).toBeTruthy();
    expect(within(card).getByText('Demo craft for the tests')).toBeTruthy();
    expect(within(card).getByText('Subsystem owner')).toBeTruthy();
    expect(card.getAttribute('href')).toBe(`/crafts/${craft.id}`);
    expect(within(list).getByText('Organisation admin')).toBeTruthy();
  });

  it('lets an org admin create a craft and shows a server field error beside the name', async () => {
    const fetchMock = mockFetch({
      'GET /api/crafts': { status: 200, body: { crafts: [craft] } },
      'GET /api/auth/session': { status: 200, body: { user: demoUser, csrfToken: 'test-csrf-token', providers: [] } },
      'POST /api/crafts': {
        status: 400,
        body: {
          error: {
            code: 'invalid_input',
            message: 'Invalid input',
            details: [{ path: 'body.name', message: 'a craft with this name already exists' }],
          },
        },
      },
    });
    renderList();
    fireEvent.click(screen.getByRole('button', { name: 'New craft' }));
    fireEvent.change(screen.getByTestId('new-craft-name'), { target: { value: 'Kite-1 pathfinder' } });
    fireEvent.click(screen.getByTestId('new-craft-submit'));

    expect((await screen.findByTestId('new-craft-name-error')).textContent).toBe('a craft with this name already exists');
    const post = fetchMock.mock.calls.find(([, init]) => init?.method === 'POST');
    expect(post?.[1]?.headers).toMatchObject({ 'x-csrf-token': 'test-csrf-token' });
    expect(JSON.parse(String(post?.[1]?.body))).toEqual({ name: 'Kite-1 pathfinder', description: '' });
  });

  it('checks the name before sending: an empty name is refused beside the field', async () => {
    const fetchMock = mockFetch({ 'GET /api/crafts': { status: 200, body: { crafts: [] } } });
    renderList();
    fireEvent.click(screen.getByRole('button', { name: 'New craft' }));
    fireEvent.click(screen.getByTestId('new-craft-submit'));
    expect((await screen.findByTestId('new-craft-name-error')).textContent).toBe('must not be empty');
    expect(fetchMock.mock.calls.some(([, init]) => init?.method === 'POST')).toBe(false);
  });
  describe('the new-craft chooser', () => {
    const templates = [
      { id: 'square-sail', name: 'Square sail', description: 'Four booms from a central hub.', parameterCount: 48 },
      { id: 'heliogyro', name: 'Heliogyro', description: 'Blades spun out from a hub.', parameterCount: 30 },
    ];

    function renderChooser() {
      const fetchMock = mockFetch({
        'GET /api/crafts': { status: 200, body: { crafts: [craft] } },
        'GET /api/templates': { status: 200, body: { templates } },
        'GET /api/auth/session': { status: 200, body: { user: demoUser, csrfToken: 'test-csrf-token', providers: [] } },
        'POST /api/crafts': (body) => ({
          status: 201,
          body: { ...craft, id: '1b2c3d4e-5f60-4718-8293-a4b5c6d7e8f9', ...(body as object) },
        }),
      });
      renderList();
      fireEvent.click(screen.getByRole('button', { name: 'New craft' }));
      return fetchMock;
    }

    async function postedBody(fetchMock: jest.Mock): Promise<unknown> {
      await waitFor(() => expect(fetchMock.mock.calls.some(([, init]) => init?.method === 'POST')).toBe(true));
      const post = fetchMock.mock.calls.find(([, init]) => init?.method === 'POST');
      return JSON.parse(String(post?.[1]?.body));
    }

    it('offers each template with its name and description, the first one chosen', async () => {
      renderChooser();
      const list = await screen.findByTestId('craft-origin-templates');
      expect(within(list).getByText('Square sail')).toBeTruthy();
      expect(within(list).getByText('Blades spun out from a hub. (30 rows)')).toBeTruthy();
      expect(screen.getByRole('radio', { name: 'Square sail' }).getAttribute('aria-checked')).toBe('true');
      expect(screen.getByRole('radio', { name: 'Heliogyro' }).getAttribute('aria-checked')).toBe('false');
    });

    it('sends the chosen template as templateId', async () => {
      const fetchMock = renderChooser();
      fireEvent.click(await screen.findByRole('radio', { name: 'Heliogyro' }));
      fireEvent.change(screen.getByTestId('new-craft-name'), { target: { value: 'Gyro-2' } });
      fireEvent.click(screen.getByTestId('new-craft-submit'));
      expect(await postedBody(fetchMock)).toEqual({ name: 'Gyro-2', description: '', templateId: 'heliogyro' });
    });

    it('sends a craft to copy as copyOf', async () => {
      const fetchMock = renderChooser();
      fireEvent.click(await screen.findByRole('radio', { name: 'Copy of Kite-1 pathfinder' }));
      expect(screen.getByRole('radio', { name: 'Square sail' }).getAttribute('aria-checked')).toBe('false');
      fireEvent.change(screen.getByTestId('new-craft-name'), { target: { value: 'Kite-1 B' } });
      fireEvent.click(screen.getByTestId('new-craft-submit'));
      expect(await postedBody(fetchMock)).toEqual({ name: 'Kite-1 B', description: '', copyOf: craft.id });
    });
  });
});
