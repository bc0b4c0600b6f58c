import { fireEvent, screen, waitFor } from '@testing-library/dom';
import SignInRoute from '@/app/(auth)/sign-in';
import { assignPageLocation } from '@/components/auth/page-navigation';
import { describeSignInError } from '@/components/auth/sign-in-screen';
import { signInErrorCodes } from '@/shared/schemas/session';
import { sessionKeys } from '@/components/auth/queries';
import { demoSession, setupQueryClient } from '../helpers/api';
import { renderRoutes } from '../helpers/render';

jest.mock('@/components/auth/page-navigation', () => ({ assignPageLocation: jest.fn() }));

describe('SignInScreen', () => {
  it('offers Google and company SSO, each starting the sign-in at the provider URL of the session', () => {
    const { wrapper } = setupQueryClient(null);
    renderRoutes({ 'sign-in': SignInRoute }, '/sign-in', wrapper);

    expect(screen.getByRole('heading', { name: 'Trimsheet' })).toBeTruthy();
    const google = screen.getByRole('button', { name: 'Sign in with Google' });
    const sso = screen.getByRole('button', { name: 'Company SSO' });
    expect(google.getAttribute('data-testid')).toBe('sign-in-google');
    expect(sso.getAttribute('data-testid')).toBe('sign-in-sso');

    fireEvent.click(google);
    expect(assignPageLocation).toHaveBeenLastCalledWith('/api/auth/google');
    fireEvent.click(sso);
    expect(assignPageLocation).toHaveBeenLastCalledWith('/api/auth/sso');
    expect(screen.queryByTestId('sign-in-error')).toBeNull();
  });

  it('shows the ?error= code from the URL as a readable message', () => {
    const { wrapper } = setupQueryClient(null);
    renderRoutes({ 'sign-in': SignInRoute }, '/sign-in?error=no_account', wrapper);

    expect(screen.getByTestId('sign-in-error').textContent).toBe(
      'There is no Trimsheet account for this sign-in. Ask an organisation admin to invite you.',
    );
  });

  it('says why a sign-in claiming an existing account by e-mail was refused', () => {
    const { wrapper } = setupQueryClient(null);
    renderRoutes({ 'sign-in': SignInRoute }, '/sign-in?error=identity_not_linked', wrapper);

    expect(screen.getByTestId('sign-in-error').textContent).toMatch(/signs in another way, so this sign-in was refused/);
    expect(screen.getByTestId('sign-in-error').textContent).toMatch(/link this sign-in on your Account page/);
  });

  it('offers the invitations of several organisations to choose from, each starting its own sign-in', () => {
    const { wrapper, queryClient } = setupQueryClient(null);
    const startUrl = '/api/auth/google?invitation=3c4d5e6f-7081-4a2b-9c3d-4e5f60718293';
    queryClient.setQueryData(sessionKeys.all, {
      ...demoSession(null),
      invitationChoice: {
        email: 'kit@outside.example',
        invitations: [
          { id: '3c4d5e6f-7081-4a2b-9c3d-4e5f60718293', organisation: 'Pelagic Orbital', invitedBy: 'Priya Lund', startUrl },
          { id: '4c4d5e6f-7081-4a2b-9c3d-4e5f60718293', organisation: 'Corvid Sailworks', invitedBy: 'Ines Marlowe', startUrl: '/x' },
        ],
      },
    });
    renderRoutes({ 'sign-in': SignInRoute }, '/sign-in?error=choose_invitation', wrapper);

    expect(screen.getByTestId('sign-in-error').textContent).toBe('More than one organisation has invited you. Choose the one to join.');
    fireEvent.click(screen.getByRole('button', { name: 'Join Pelagic Orbital' }));
    expect(assignPageLocation).toHaveBeenLastCalledWith(startUrl);
    expect(screen.getByRole('button', { name: 'Join Corvid Sailworks' })).toBeTruthy();
  });

  it('titles the page', async () => {
    const { wrapper } = setupQueryClient(null);
    renderRoutes({ 'sign-in': SignInRoute }, '/sign-in', wrapper);
    await waitFor(() => expect(document.title).toBe('Sign in · Trimsheet'));
  });

  it('has a message for every sign-in error code of the API', () => {
    for (const code of signInErrorCodes) expect(describeSignInError(code)).not.toMatch(/did not complete/);
  });

  it('still says something readable for a code it does not know, and never an empty reason', () => {
    expect(describeSignInError('clock_skew')).toBe('Sign-in did not complete (clock skew). Please try again.');
    expect(describeSignInError('__')).toBe('Sign-in did not complete (unknown reason). Please try again.');
  });
});
