import { fireEvent, screen, waitFor } from '@testing-library/dom';
import { describeLinkResult, LinkedSignIns } from '@/components/account/linked-sign-ins';
import { assignPageLocation } from '@/components/auth/page-navigation';
import { identityLinkResults } from '@/shared/schemas/session';
import { demoSession, demoUser, mockFetch, setupQueryClient, type Route } from '../helpers/api';
import { renderDom } from '../helpers/render';

jest.mock('@/components/auth/page-navigation', () => ({ assignPageLocation: jest.fn() }));

function renderCard(routes: Record<string, Route>, props: { linkResult?: string; linkProvider?: string } = {}) {
  const fetchMock = mockFetch({ 'GET /api/auth/session': { status: 200, body: demoSession(demoUser) }, ...routes });
  const { wrapper: Wrapper } = setupQueryClient();
  renderDom(
    <Wrapper>
      <LinkedSignIns {...props} />
    </Wrapper>,
  );
  return fetchMock;
}

describe('LinkedSignIns', () => {
  it('shows the linked providers and links another through the provider, after asking the server', async () => {
    const fetchMock = renderCard({
      'GET /api/account/identities': { status: 200, body: { identities: [{ provider: 'sso', linkedAt: '2026-12-01T10:00:00.000Z' }] } },
      'POST /api/account/identities': { status: 200, body: { startUrl: '/api/auth/google' } },
    });
    expect(await screen.findByText('Linked')).toBeTruthy();
    expect(screen.queryByTestId('link-sso')).toBeNull();
    fireEvent.click(screen.getByRole('button', { name: 'Link Google sign-in' }));
    await waitFor(() => expect(assignPageLocation).toHaveBeenCalledWith('/api/auth/google'));
    const post = fetchMock.mock.calls.find(([, init]) => init?.method === 'POST');
    expect(JSON.parse(String(post?.[1]?.body))).toEqual({ provider: 'google' });
  });

  it('says how a link request came back', async () => {
    renderCard(
      { 'GET /api/account/identities': { status: 200, body: { identities: [] } } },
      { linkResult: 'identity_in_use', linkProvider: 'google' },
    );
    expect((await screen.findByTestId('link-result')).textContent).toBe(
      'Your Google sign-in belongs to another Trimsheet person, so it was not linked.',
    );
  });

  it('has a sentence for every link result, and none for an unknown one', () => {
    for (const result of identityLinkResults) expect(describeLinkResult(result, 'sso')?.text).toMatch(/^Your Company SSO sign-in /);
    expect(describeLinkResult('whatever', 'sso')).toBeNull();
    expect(describeLinkResult(undefined, undefined)).toBeNull();
  });
});
