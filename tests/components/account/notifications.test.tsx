import { fireEvent, screen, waitFor } from '@testing-library/dom';
import { MailPreferencesCard, NotificationList } from '@/components/account/notifications';
import type { Notification } from '@/shared/schemas/notifications';
import { demoSession, demoUser, mockFetch, setupQueryClient, type Route } from '../helpers/api';
import { renderDom } from '../helpers/render';

const changed: Notification = {
  id: '4d5e6f70-8192-4a3b-9c4d-5e6f708192a3',
  kind: 'row_changed',
  craftId: '3c2b1a09-8f7e-4d6c-9b5a-4f3e2d1c0b9a',
  title: 'Rhea Calder changed boom_linear_density on Kestrel',
  body: 'boom_linear_density: 20 g/m → 16 g/m',
  actor: { id: 'f4c1a2b3-5d6e-4f70-8a9b-0c1d2e3f4a5b', name: 'Rhea Calder' },
  createdAt: '2026-12-01T10:15:00.000Z',
  readAt: null,
};

function render(routes: Record<string, Route>, children: React.ReactNode) {
  const fetchMock = mockFetch({ 'GET /api/auth/session': { status: 200, body: demoSession(demoUser) }, ...routes });
  const { wrapper: Wrapper } = setupQueryClient();
  renderDom(<Wrapper>{children}</Wrapper>);
  return fetchMock;
}

function bodiesOf(fetchMock: jest.Mock, method: string, path: string): unknown[] {
  return fetchMock.mock.calls
    .filter(([url, init]) => init?.method === method && String(url).endsWith(path))
    .map(([, init]) => JSON.parse(String(init?.body ?? 'null')) as unknown);
}

describe('NotificationList', () => {
  it('shows the notifications with the unread count, and marks them all read', async () => {
    const fetchMock = render(
      {
        'GET /api/notifications': { status: 200, body: { notifications: [changed], unread: 1 } },
        'POST /api/notifications/read': { status: 204 },
      },
      <NotificationList />,
    );
    expect((await screen.findByTestId(`notification-${changed.id}`)).textContent).toContain('20 g/m → 16 g/m');
    expect(screen.getByTestId('account-notifications').textContent).toContain('1 unread');
    fireEvent.click(screen.getByTestId('notifications-read-all'));
    await waitFor(() => expect(bodiesOf(fetchMock, 'POST', '/api/notifications/read')).toEqual([{}]));
  });

  it('says what will show there when there is nothing yet', async () => {
    render({ 'GET /api/notifications': { status: 200, body: { notifications: [], unread: 0 } } }, <NotificationList />);
    expect((await screen.findByText('Nothing yet')).textContent).toBe('Nothing yet');
    expect(screen.queryByTestId('notifications-read-all')).toBeNull();
  });
});

describe('MailPreferencesCard', () => {
  it('turns one kind of mail off, keeping the others', async () => {
    // The server keeps what was last saved.
    let saved: unknown = { mail: { baseline_locked: true, study_promoted: true, row_changed: true } };
    const fetchMock = render(
      {
        'GET /api/account/mail-preferences': () => ({ status: 200, body: saved }),
        'PUT /api/account/mail-preferences': (body) => {
          saved = body;
          return { status: 200, body };
        },
      },
      <MailPreferencesCard />,
    );
    fireEvent.click(await screen.findByTestId('mail-row_changed'));
    await waitFor(() =>
      expect(bodiesOf(fetchMock, 'PUT', '/api/account/mail-preferences')).toEqual([
        { mail: { baseline_locked: true, study_promoted: true, row_changed: false } },
      ]),
    );
    await waitFor(() => expect(screen.getByTestId('mail-row_changed').getAttribute('aria-checked')).toBe('false'));
  });
});
