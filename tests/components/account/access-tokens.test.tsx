import { fireEvent, screen, waitFor, within } from '@testing-library/dom';
import { AccessTokens } from '@/components/account/access-tokens';
import type { AccessToken } from '@/shared/schemas/tokens';
import { demoSession, demoUser, mockFetch, setupQueryClient, type Route } from '../helpers/api';
import { renderDom } from '../helpers/render';

const ciToken: AccessToken = {
  id: '2a3b4c5d-6e7f-4819-8a2b-3c4d5e6f7a8b',
  name: 'Nightly export',
  scope: 'read',
  prefix: 'tsk_9f3a',
  createdAt: '2026-11-10T08:00:00.000Z',
  lastUsedAt: null,
  revokedAt: null,
};
const secret = 'tsk_5b7c1e9d0a2f4c6e8a0b2d4f6a8c0e2a';

function renderTokens(routes: Record<string, Route>) {
  const fetchMock = mockFetch({ 'GET /api/auth/session': { status: 200, body: demoSession(demoUser) }, ...routes });
  const { wrapper: Wrapper } = setupQueryClient();
  renderDom(
    <Wrapper>
      <AccessTokens />
    </Wrapper>,
  );
  return fetchMock;
}

function sent(fetchMock: jest.Mock, method: string) {
  return fetchMock.mock.calls.filter(([, init]) => init?.method === method);
}

describe('AccessTokens', () => {
  it('lists each token with its name, scope, prefix, creation and last use', async () => {
    renderTokens({
      'GET /api/account/tokens': {
        status: 200,
        body: {
          tokens: [
            ciToken,
            {
              ...ciToken,
              id: '9b8a7c6d-5e4f-4a3b-8c2d-1e0f9a8b7c6d',
              name: 'Mass sync',
              scope: 'read_write',
              lastUsedAt: '2026-11-28T12:00:00.000Z',
            },
          ],
        },
      },
    });
    const row = await screen.findByTestId(`token-${ciToken.id}`);
    expect(within(row).getByText('Nightly export')).toBeTruthy();
    expect(within(row).getByText('Read')).toBeTruthy();
    expect(within(row).getByText('tsk_9f3a… · created 2026-11-10 · last used never')).toBeTruthy();
    const other = screen.getByTestId('token-9b8a7c6d-5e4f-4a3b-8c2d-1e0f9a8b7c6d');
    expect(within(other).getByText('Read and write')).toBeTruthy();
    expect(within(other).getByText('tsk_9f3a… · created 2026-11-10 · last used 2026-11-28')).toBeTruthy();
  });

  it('creates a token with its name and scope and shows the secret once, until dismissed', async () => {
    let tokens: AccessToken[] = [];
    const fetchMock = renderTokens({
      'GET /api/account/tokens': () => ({ status: 200, body: { tokens } }),
      'POST /api/account/tokens': (body) => {
        const created = { ...ciToken, ...(body as object) };
        tokens = [created];
        return { status: 201, body: { token: created, secret } };
      },
    });
    expect(await screen.findByText('No tokens')).toBeTruthy();
    fireEvent.change(screen.getByTestId('new-token-name'), { target: { value: 'Mass sync' } });
    fireEvent.click(screen.getByRole('radio', { name: 'Read and write' }));
    fireEvent.click(screen.getByTestId('new-token-submit'));

    expect((await screen.findByTestId('token-secret-value')).textContent).toBe(secret);
    expect(JSON.parse(String(sent(fetchMock, 'POST')[0]?.[1]?.body))).toEqual({ name: 'Mass sync', scope: 'read_write' });
    expect(await screen.findByText('Mass sync')).toBeTruthy();
    // The list never carries the secret: only the box shown after creating it does.
    expect(within(screen.getByTestId('token-list')).queryByText(secret)).toBeNull();

    fireEvent.click(screen.getByTestId('token-secret-done'));
    expect(screen.queryByText(secret)).toBeNull();
    expect(screen.getByTestId('new-token-name')).toBeTruthy();
  });

  it('copies the secret to the clipboard where the browser offers one', async () => {
    const writeText = jest.fn(async () => undefined);
    Object.defineProperty(navigator, 'clipboard', { value: { writeText }, configurable: true });
    try {
      renderTokens({
        'GET /api/account/tokens': { status: 200, body: { tokens: [] } },
        'POST /api/account/tokens': { status: 201, body: { token: ciToken, secret } },
      });
      await screen.findByText('No tokens');
      fireEvent.change(screen.getByTestId('new-token-name'), { target: { value: 'Nightly export' } });
      fireEvent.click(screen.getByTestId('new-token-submit'));
      fireEvent.click(await screen.findByTestId('token-secret-copy'));
      expect(writeText).toHaveBeenCalledWith(secret);
      expect(await screen.findByRole('button', { name: 'Copied' })).toBeTruthy();
    } finally {
      Reflect.deleteProperty(navigator, 'clipboard');
    }
  });

  it('checks the name before sending', async () => {
    const fetchMock = renderTokens({ 'GET /api/account/tokens': { status: 200, body: { tokens: [] } } });
    await screen.findByText('No tokens');
    fireEvent.click(screen.getByTestId('new-token-submit'));
    expect((await screen.findByTestId('new-token-name-error')).textContent).toBe('must not be empty');
    expect(sent(fetchMock, 'POST')).toHaveLength(0);
  });

  it('revokes a token after a confirmation, and the list then shows it revoked', async () => {
    let tokens: AccessToken[] = [ciToken];
    const fetchMock = renderTokens({
      'GET /api/account/tokens': () => ({ status: 200, body: { tokens } }),
      [`DELETE /api/account/tokens/${ciToken.id}`]: () => {
        tokens = [{ ...ciToken, revokedAt: '2026-12-01T10:00:00.000Z' }];
        return { status: 204 };
      },
    });
    fireEvent.click(await screen.findByRole('button', { name: 'Revoke Nightly export' }));
    expect(sent(fetchMock, 'DELETE')).toHaveLength(0);
    fireEvent.click(screen.getByTestId(`token-${ciToken.id}-confirm`));
    await waitFor(() => expect(sent(fetchMock, 'DELETE')).toHaveLength(1));
    expect(await screen.findByText('Revoked')).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Revoke Nightly export' })).toBeNull();
  });

  it('says why the tokens cannot be loaded', async () => {
    renderTokens({ 'GET /api/account/tokens': { status: 500, body: { error: { code: 'internal', message: 'Database unavailable' } } } });
    expect(await screen.findByText('Could not load your tokens')).toBeTruthy();
    expect(screen.getByText('Database unavailable')).toBeTruthy();
  });
});
