import { fireEvent, screen } from '@testing-library/dom';
import { AppNavigation } from '@/components/ui/app-navigation';
import { AppText } from '@/components/ui/text';
import { setupQueryClient } from '../helpers/api';
import { renderRoutes } from '../helpers/render';

const mockWidth = { current: 390 };
// Babel rewrites `useWindowDimensions` from 'react-native' to this react-native-web module.
jest.mock('react-native-web/dist/exports/useWindowDimensions', () => ({
  __esModule: true,
  default: () => ({ width: mockWidth.current, height: 800, scale: 1, fontScale: 1 }),
}));

function renderShell(width: number, showPeople: boolean) {
  mockWidth.current = width;
  const { wrapper } = setupQueryClient();
  renderRoutes(
    {
      _layout: () => <AppNavigation showPeople={showPeople} />,
      'crafts/index': () => <AppText>crafts page</AppText>,
      sandbox: () => <AppText>sandbox page</AppText>,
      people: () => <AppText>people page</AppText>,
      account: () => <AppText>account page</AppText>,
    },
    '/crafts',
    wrapper,
  );
}

describe('AppNavigation', () => {
  it('puts the tabs along the bottom on a phone-wide window', () => {
    renderShell(390, true);
    expect(screen.getByTestId('nav-bottom')).toBeTruthy();
    expect(screen.queryByTestId('nav-side')).toBeNull();
  });

  it('turns into a side navigation from 900 px wide', () => {
    renderShell(900, true);
    expect(screen.getByTestId('nav-side')).toBeTruthy();
    expect(screen.queryByTestId('nav-bottom')).toBeNull();
  });

  it('switches tabs and marks the open one', () => {
    renderShell(1280, true);
    expect(screen.getByText('crafts page')).toBeTruthy();
    fireEvent.click(screen.getByRole('tab', { name: 'Account' }));
    expect(screen.getByText('account page')).toBeTruthy();
    expect(screen.getByRole('tab', { name: 'Account' }).getAttribute('aria-selected')).toBe('true');
    expect(screen.getByRole('tab', { name: 'Crafts' }).getAttribute('aria-selected')).toBe('false');
  });

  it('offers People only to organisation admins', () => {
    renderShell(390, false);
    expect(screen.getByRole('tab', { name: 'Crafts' })).toBeTruthy();
    expect(screen.getByRole('tab', { name: 'Account' })).toBeTruthy();
    expect(screen.queryByRole('tab', { name: 'People' })).toBeNull();
  });
});
