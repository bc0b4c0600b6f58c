import { fireEvent, screen, waitFor, within } from '@testing-library/dom';
import { PeopleScreen } from '@/components/members/people-screen';
import { demoSession, demoUser, mockFetch, setupQueryClient } from '../helpers/api';
import { renderDom } from '../helpers/render';

const lena = { id: '9a8b7c6d-5e4f-4a3b-8c2d-1e0f9a8b7c6d', name: 'Lena Brandt', email: 'lena@helios.example', isOrgAdmin: false };

const invitation = {
  id: '1b2c3d4e-5f60-4a7b-8c9d-0e1f2a3b4c5d',
  email: 'kim@helios.example',
  name: 'Kim Sato',
  provider: 'google',
  invitedBy: demoUser.name,
  createdAt: '2026-12-01T10:00:00.000Z',
  acceptedAt: null,
  withdrawnAt: null,
};

function renderPeople(isOrgAdmin: boolean, routes: Parameters<typeof mockFetch>[0] = {}) {
  const fetchMock = mockFetch({
    'GET /api/organisation': {
      status: 200,
      body: {
        organisation: demoUser.organisation,
        directory: 'organisation',
        people: [{ id: demoUser.id, name: demoUser.name, email: demoUser.email, isOrgAdmin: true }, lena],
        invitations: [invitation, { ...invitation, id: '2b2c3d4e-5f60-4a7b-8c9d-0e1f2a3b4c5d', withdrawnAt: '2026-12-02T10:00:00.000Z' }],
      },
    },
    ...routes,
  });
  const { wrapper: Wrapper } = setupQueryClient({ ...demoUser, isOrgAdmin });
  renderDom(
    <Wrapper>
      <PeopleScreen />
    </Wrapper>,
  );
  return fetchMock;
}

describe('PeopleScreen', () => {
  it('lists the people with their admin switches for those who may invite and appoint admins', async () => {
    renderPeople(true);
    const row = await screen.findByTestId(`org-person-${lena.id}`);
    expect(within(row).getByText('Lena Brandt')).toBeTruthy();
    const toggle = within(row).getByRole('switch', { name: 'Organisation admin: Lena Brandt' });
    expect(toggle.getAttribute('aria-checked')).toBe('false');
    expect(toggle.getAttribute('aria-disabled')).not.toBe('true');
    expect(screen.getByRole('heading', { name: 'Invite a person' })).toBeTruthy();
  });

  it('withdraws a waiting invitation, and offers no withdrawal for a withdrawn one', async () => {
    const fetchMock = renderPeople(true, {
      'GET /api/auth/session': { status: 200, body: demoSession({ ...demoUser, isOrgAdmin: true }) },
      [`DELETE /api/organisation/invitations/${invitation.id}`]: { status: 204 },
    });
    const row = await screen.findByTestId(`invitation-${invitation.id}`);
    expect(within(row).getByText('Waiting')).toBeTruthy();
    expect(within(screen.getByTestId('invitation-2b2c3d4e-5f60-4a7b-8c9d-0e1f2a3b4c5d')).getByText('Withdrawn')).toBeTruthy();
    expect(screen.queryByTestId('withdraw-invitation-2b2c3d4e-5f60-4a7b-8c9d-0e1f2a3b4c5d')).toBeNull();
    fireEvent.click(within(row).getByRole('button', { name: `Withdraw the invitation to ${invitation.email}` }));
    await waitFor(() =>
      expect(
        fetchMock.mock.calls.some(([url, init]) => String(url).endsWith(`/invitations/${invitation.id}`) && init?.method === 'DELETE'),
      ).toBe(true),
    );
  });

  it('tells a member without that permission who manages people, and shows no one', () => {
    renderPeople(false);
    expect(screen.getByText('Only organisation admins manage people and invitations.')).toBeTruthy();
    expect(screen.queryByTestId('people-list')).toBeNull();
  });
});
