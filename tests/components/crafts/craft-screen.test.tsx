import { fireEvent, screen, waitFor, within } from '@testing-library/dom';
import { CraftScreen } from '@/components/crafts/craft-screen';
import type { Craft } from '@/shared/schemas/crafts';
import type { Member } from '@/shared/schemas/members';
import type { CraftRole } from '@/shared/schemas/roles';
import { demoSession, demoUser, mockFetch, setupQueryClient, type Route } from '../helpers/api';
import { renderRoutes } from '../helpers/render';

const craftId = '3c2b1a09-8f7e-4d6c-9b5a-4f3e2d1c0b9a';
const lena = { id: '9a8b7c6d-5e4f-4a3b-8c2d-1e0f9a8b7c6d', name: 'Lena Brandt', email: 'lena@helios.example', isOrgAdmin: false };
const owner: Member = { userId: demoUser.id, name: demoUser.name, email: demoUser.email, role: 'chief_engineer', subsystems: [] };

function craftWith(myRole: CraftRole | null): Craft {
  return {
    id: craftId,
    organisationId: demoUser.organisation.id,
    name: 'Kite-1 pathfinder',
    description: 'Demo craft',
    myRole,
    templateId: 'square-sail',
    draftRevisionId: null,
    createdAt: '2026-11-02T09:00:00.000Z',
    updatedAt: '2026-11-20T16:30:00.000Z',
  };
}

function renderCraft(myRole: CraftRole | null, isOrgAdmin: boolean, extra: Record<string, Route> = {}) {
  const fetchMock = mockFetch({
    [`GET /api/crafts/${craftId}`]: { status: 200, body: craftWith(myRole) },
    [`GET /api/crafts/${craftId}/members`]: { status: 200, body: { members: [owner] } },
    'GET /api/auth/session': { status: 200, body: demoSession(demoUser) },
    ...extra,
  });
  const { wrapper } = setupQueryClient({ ...demoUser, isOrgAdmin });
  renderRoutes(
    { 'crafts/[craftId]/index': () => <CraftScreen craftId={craftId} />, 'crafts/index': () => null },
    `/crafts/${craftId}`,
    wrapper,
  );
  return fetchMock;
}

describe('CraftScreen', () => {
  it('shows a viewer the craft, their role and the members, with nothing to change', async () => {
    renderCraft('viewer', false);
    expect(await screen.findByRole('heading', { name: 'Kite-1 pathfinder' })).toBeTruthy();
    expect(within(screen.getByTestId('craft-summary')).getByText('Viewer')).toBeTruthy();
    expect(within(await screen.findByTestId('member-list')).getByText('Ada Okafor')).toBeTruthy();
    expect(screen.queryByTestId('edit-craft')).toBeNull();
    expect(screen.queryByTestId('add-member')).toBeNull();
    expect(screen.queryByRole('button', { name: 'Change role of Ada Okafor' })).toBeNull();
  });

  it('lets a chief engineer edit name and description but not membership', async () => {
    renderCraft('chief_engineer', false);
    expect(await screen.findByTestId('edit-craft')).toBeTruthy();
    await screen.findByTestId('member-list');
    expect(screen.queryByTestId('add-member')).toBeNull();
  });

  it('lets an org admin add a subsystem owner, asking for the subsystems first', async () => {
    const fetchMock = renderCraft(null, true, {
      'GET /api/organisation': {
        status: 200,
        body: {
          organisation: demoUser.organisation,
          directory: 'organisation',
          people: [{ id: demoUser.id, name: demoUser.name, email: demoUser.email, isOrgAdmin: true }, lena],
          invitations: [],
        },
      },
      [`PUT /api/crafts/${craftId}/members/${lena.id}`]: (body) => ({
        status: 200,
        body: { userId: lena.id, name: lena.name, email: lena.email, ...(body as object) },
      }),
    });
    expect(within(await screen.findByTestId('craft-summary')).getByText('Organisation admin')).toBeTruthy();
    fireEvent.click(await screen.findByTestId('add-member'));
    const person = await screen.findByRole('radio', { name: 'Lena Brandt' });
    // Someone already on the craft is not offered again.
    expect(screen.queryByRole('radio', { name: 'Ada Okafor' })).toBeNull();
    fireEvent.click(screen.getByRole('radio', { name: 'Subsystem owner' }));
    fireEvent.change(screen.getByTestId('add-member-subsystems'), { target: { value: 'Booms' } });
    fireEvent.click(screen.getByTestId('add-member-submit'));
    expect(await screen.findByText('Choose the person to add.')).toBeTruthy();

    fireEvent.click(person);
    fireEvent.change(screen.getByTestId('add-member-subsystems'), { target: { value: ' , ' } });
    fireEvent.click(screen.getByTestId('add-member-submit'));
    expect((await screen.findByTestId('add-member-subsystems-error')).textContent).toBe('a subsystem owner needs at least one subsystem');

    fireEvent.change(screen.getByTestId('add-member-subsystems'), { target: { value: `Booms, ${'x'.repeat(61)}` } });
    fireEvent.click(screen.getByTestId('add-member-submit'));
    expect((await screen.findByTestId('add-member-subsystems-error')).textContent).toBe(
      `“${'x'.repeat(61)}”: must be at most 60 characters`,
    );

    fireEvent.change(screen.getByTestId('add-member-subsystems'), { target: { value: 'Sail membrane, Booms ,' } });
    fireEvent.click(screen.getByTestId('add-member-submit'));
    await waitFor(() => expect(fetchMock.mock.calls.some(([, init]) => init?.method === 'PUT')).toBe(true));
    const put = fetchMock.mock.calls.find(([, init]) => init?.method === 'PUT');
    expect(JSON.parse(String(put?.[1]?.body))).toEqual({ role: 'subsystem_owner', subsystems: ['Sail membrane', 'Booms'] });
  });

  it('says the craft does not exist on a 404, without offering to retry', async () => {
    mockFetch({ [`GET /api/crafts/${craftId}`]: { status: 404, body: { error: { code: 'not_found', message: 'No such craft' } } } });
    const { wrapper } = setupQueryClient();
    renderRoutes({ 'crafts/[craftId]/index': () => <CraftScreen craftId={craftId} /> }, `/crafts/${craftId}`, wrapper);
    expect(await screen.findByText('This craft does not exist, or it belongs to another organisation.')).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Try again' })).toBeNull();
  });

  it('refuses a malformed craft id in the address without asking the server', async () => {
    const fetchMock = mockFetch({});
    const { wrapper } = setupQueryClient();
    renderRoutes({ 'crafts/[craftId]/index': () => <CraftScreen craftId="kite-1" /> }, '/crafts/kite-1', wrapper);
    expect(await screen.findByText('“kite-1” in the address is not a craft identifier.')).toBeTruthy();
    expect(fetchMock).not.toHaveBeenCalled();
  });
});
