import { fireEvent, screen, waitFor } from '@testing-library/dom';
import type { ReactNode } from 'react';
import RootLayout from '@/app/_layout';
import Index from '@/app/index';
import SignInRoute from '@/app/(auth)/sign-in';
import AppLayout from '@/app/(app)/_layout';
import AccountRoute from '@/app/(app)/account';
import CraftsLayout from '@/app/(app)/crafts/_layout';
import CraftsRoute from '@/app/(app)/crafts/index';
import CraftRoute from '@/app/(app)/crafts/[craftId]/index';
import PeopleRoute from '@/app/(app)/people';
import { demoSession, demoUser, mockFetch } from '../helpers/api';
import { renderRoutes } from '../helpers/render';

// The real route files, as expo-router would find them under app/.
const appRoutes = {
  _layout: RootLayout,
  index: Index,
  '(auth)/sign-in': SignInRoute,
  '(app)/_layout': AppLayout,
  '(app)/crafts/_layout': CraftsLayout,
  '(app)/crafts/index': CraftsRoute,
  '(app)/crafts/[craftId]/index': CraftRoute,
  '(app)/people': PeopleRoute,
  '(app)/account': AccountRoute,
};

// The root layout brings its own providers (query client, safe area, fonts).
const Bare = ({ children }: { children: ReactNode }) => children;

describe('the session guard in the root layout', () => {
  it('sends a signed-out visitor of /crafts to sign-in', async () => {
    mockFetch({ 'GET /api/auth/session': { status: 200, body: demoSession(null) } });
    renderRoutes(appRoutes, '/crafts', Bare);
    expect(await screen.findByTestId('sign-in-google')).toBeTruthy();
    expect(screen.queryByTestId('craft-list')).toBeNull();
  });

  it('opens the craft list for a signed-in person at /', async () => {
    mockFetch({
      'GET /api/auth/session': { status: 200, body: demoSession(demoUser) },
      'GET /api/crafts': { status: 200, body: { crafts: [] } },
    });
    renderRoutes(appRoutes, '/', Bare);
    expect(await screen.findByTestId('craft-list')).toBeTruthy();
    expect(screen.queryByTestId('sign-in-google')).toBeNull();
  });

  it('shows sign-in after “Sign out”, having told the server', async () => {
    let signedIn = true;
    const fetchMock = mockFetch({
      'GET /api/auth/session': () => ({ status: 200, body: demoSession(signedIn ? demoUser : null) }),
      'POST /api/auth/sign-out': () => {
        signedIn = false;
        return { status: 204 };
      },
    });
    renderRoutes(appRoutes, '/account', Bare);

    fireEvent.click(await screen.findByTestId('sign-out'));
    expect(await screen.findByTestId('sign-in-google')).toBeTruthy();
    await waitFor(() =>
      expect(fetchMock.mock.calls.some(([path, init]) => path === '/api/auth/sign-out' && init?.method === 'POST')).toBe(true),
    );
  });

  it('returns to sign-in when a request finds the session ended elsewhere (401)', async () => {
    let signedIn = true;
    mockFetch({
      'GET /api/auth/session': () => ({ status: 200, body: demoSession(signedIn ? demoUser : null) }),
      'GET /api/crafts': () => {
        signedIn = false;
        return { status: 401, body: { error: { code: 'unauthenticated', message: 'Sign in first.' } } };
      },
    });
    renderRoutes(appRoutes, '/crafts', Bare);
    expect(await screen.findByTestId('sign-in-google')).toBeTruthy();
  });

  it('says so, and offers to try again, when the session cannot be fetched', async () => {
    mockFetch({ 'GET /api/auth/session': { status: 503, body: { error: { code: 'unavailable', message: 'Server is starting' } } } });
    renderRoutes(appRoutes, '/', Bare);
    // The app's query client retries a 5xx twice (1 s, then 2 s) before giving up.
    expect(await screen.findByText('Trimsheet cannot reach its server', {}, { timeout: 6000 })).toBeTruthy();
    expect(screen.getByText('Server is starting')).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Try again' })).toBeTruthy();
  }, 10_000);
});
