import { PeopleScreen } from '@/components/members/people-screen';

/** /people (organisation admins). */
export default function PeopleRoute() {
  return <PeopleScreen />;
}
