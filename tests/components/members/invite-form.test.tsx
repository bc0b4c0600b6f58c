import { fireEvent, screen, waitFor, within } from '@testing-library/dom';
import { InviteForm } from '@/components/members/invite-form';
import { demoSession, demoUser, mockFetch, setupQueryClient } from '../helpers/api';
import { renderDom } from '../helpers/render';

/** The server's answer to an invitation: the invitation as sent, waiting. */
const invitationSent = (body: unknown) => ({
  status: 201,
  body: {
    id: '5e4d3c2b-1a09-4f8e-9d7c-6b5a4f3e2d1c',
    ...(body as object),
    invitedBy: demoUser.name,
    createdAt: '2026-12-01T10:00:00.000Z',
    acceptedAt: null,
    withdrawnAt: null,
  },
});

function renderForm() {
  const { wrapper: Wrapper } = setupQueryClient(demoUser);
  renderDom(
    <Wrapper>
      <InviteForm />
    </Wrapper>,
  );
}

function fillIn(name: string, email: string) {
  fireEvent.change(screen.getByTestId('invite-name'), { target: { value: name } });
  fireEvent.change(screen.getByTestId('invite-email'), { target: { value: email } });
  fireEvent.click(screen.getByTestId('invite-submit'));
}

describe('InviteForm', () => {
  it('shows the server field error beside the e-mail field', async () => {
    mockFetch({
      'GET /api/auth/session': { status: 200, body: demoSession(demoUser) },
      'POST /api/organisation/invitations': {
        status: 409,
        body: {
          error: {
            code: 'conflict',
            message: 'Already invited',
            details: [{ path: 'body.email', message: 'this person is already invited' }],
          },
        },
      },
    });
    renderForm();
    fillIn('Kim Sato', 'kim@helios.example');

    expect((await screen.findByTestId('invite-email-error')).textContent).toBe('this person is already invited');
    expect(screen.getByTestId('invite-email').getAttribute('aria-invalid')).toBe('true');
    expect(screen.queryByTestId('invite-name-error')).toBeNull();
  });

  it('refuses a malformed e-mail beside the field without asking the server', async () => {
    const fetchMock = mockFetch({});
    renderForm();
    fillIn('Kim Sato', 'kim-at-helios');

    expect((await screen.findByTestId('invite-email-error')).textContent).toBe('must be an e-mail address');
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('sends the trimmed, lower-cased invitation and says where it went', async () => {
    const fetchMock = mockFetch({
      'GET /api/auth/session': { status: 200, body: demoSession(demoUser) },
      'POST /api/organisation/invitations': invitationSent,
    });
    renderForm();
    fillIn('  Kim Sato ', ' Kim@Helios.example ');

    await screen.findByText('Invitation sent to kim@helios.example.');
    const post = fetchMock.mock.calls.find(([, init]) => init?.method === 'POST');
    expect(JSON.parse(String(post?.[1]?.body))).toEqual({ name: 'Kim Sato', email: 'kim@helios.example', provider: null });
    await waitFor(() => expect((screen.getByTestId('invite-name') as HTMLInputElement).value).toBe(''));
  });

  it('sends the provider chosen for the invitation', async () => {
    const fetchMock = mockFetch({
      'GET /api/auth/session': { status: 200, body: demoSession(demoUser) },
      'POST /api/organisation/invitations': invitationSent,
    });
    renderForm();
    fireEvent.click(within(screen.getByTestId('invite-provider')).getByRole('radio', { name: 'Google' }));
    fillIn('Kim Sato', 'kim@helios.example');

    await screen.findByText('Invitation sent to kim@helios.example.');
    const post = fetchMock.mock.calls.find(([, init]) => init?.method === 'POST');
    expect(JSON.parse(String(post?.[1]?.body))).toEqual({ name: 'Kim Sato', email: 'kim@helios.example', provider: 'google' });
  });
});
