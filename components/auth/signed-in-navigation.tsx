import { AppNavigation } from '@/components/ui/app-navigation';
import { mayInOrganisation } from '@/shared/access/permissions';
import { useSessionUser } from './queries';

/** The signed-in area's navigation; People only for those who may invite people (the permission table says who). */
export function SignedInNavigation() {
  const user = useSessionUser();
  return <AppNavigation showPeople={user !== null && mayInOrganisation('invitePeople', user)} />;
}
