import Head from 'expo-router/head';
import { PeopleScreen } from '@/components/members/people-screen';

/** /people (organisation admins). */
export default function PeopleRoute() {
  return (
    <>
      <Head>
        <title>People · Trimsheet</title>
      </Head>
      <PeopleScreen />
    </>
  );
}
