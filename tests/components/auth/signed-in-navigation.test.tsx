import { screen } from '@testing-library/dom';
import { SignedInNavigation } from '@/components/auth/signed-in-navigation';
import { AppText } from '@/components/ui/text';
import { demoUser, setupQueryClient } from '../helpers/api';
import { renderRoutes } from '../helpers/render';

function renderShell(isOrgAdmin: boolean) {
  const { wrapper } = setupQueryClient({ ...demoUser, isOrgAdmin });
  renderRoutes(
    {
      _layout: SignedInNavigation,
      'crafts/index': () => <AppText>crafts page</AppText>,
      sandbox: () => <AppText>sandbox page</AppText>,
      people: () => <AppText>people page</AppText>,
      account: () => <AppText>account page</AppText>,
    },
    '/crafts',
    wrapper,
  );
}

describe('SignedInNavigation', () => {
  it('offers People to those the permission table lets invite people', () => {
    renderShell(true);
    expect(screen.getByRole('tab', { name: 'People' })).toBeTruthy();
  });

  it('leaves People out for everyone else', () => {
    renderShell(false);
    expect(screen.getByRole('tab', { name: 'Crafts' })).toBeTruthy();
    expect(screen.queryByRole('tab', { name: 'People' })).toBeNull();
  });
});
