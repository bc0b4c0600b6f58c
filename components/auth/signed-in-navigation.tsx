import { AppNavigation } from '@/components/ui/app-navigation';
import { useSessionUser } from './queries';

/** The signed-in area's navigation; People only for organisation admins. */
export function SignedInNavigation() {
  const user = useSessionUser();
  return <AppNavigation showPeople={user?.isOrgAdmin ?? false} />;
}
