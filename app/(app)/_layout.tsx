import { useSessionUser } from '@/components/auth/queries';
import { AppNavigation } from '@/components/ui/app-navigation';

/** Signed-in area: the tab navigation; People only for organisation admins. */
export default function AppLayout() {
  const user = useSessionUser();
  return <AppNavigation showPeople={user?.isOrgAdmin ?? false} />;
}
