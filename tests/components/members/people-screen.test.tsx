import { screen, within } from '@testing-library/dom';
import { PeopleScreen } from '@/components/members/people-screen';
import { demoUser, mockFetch, setupQueryClient } from '../helpers/api';
import { renderDom } from '../helpers/render';

const lena = { id: '9a8b7c6d-5e4f-4a3b-8c2d-1e0f9a8b7c6d', name: 'Lena Brandt', email: 'lena@helios.example', isOrgAdmin: false };

function renderPeople(isOrgAdmin: boolean) {
  const fetchMock = mockFetch({
    'GET /api/organisation': {
      status: 200,
      body: {
        organisation: demoUser.organisation,
        people: [{ id: demoUser.id, name: demoUser.name, email: demoUser.email, isOrgAdmin: true }, lena],
        invitations: [],
      },
    },
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

  it('tells a member without that permission who manages people, and shows no one', () => {
    renderPeople(false);
    expect(screen.getByText('Only organisation admins manage people and invitations.')).toBeTruthy();
    expect(screen.queryByTestId('people-list')).toBeNull();
  });
});
