import { SignedInNavigation } from '@/components/auth/signed-in-navigation';

/** Signed-in area: the tab navigation. */
export default function AppLayout() {
  return <SignedInNavigation />;
}
