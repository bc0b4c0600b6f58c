import { PeopleScreen } from '@/components/members/people-screen';
import { PageTitle } from '@/components/ui/page-title';

/** /people (organisation admins). */
export default function PeopleRoute() {
  return (
    <>
      <PageTitle title="People" />
      <PeopleScreen />
    </>
  );
}
