import Head from 'expo-router/head';
import { AccountScreen } from '@/components/account/account-screen';

/** /account */
export default function AccountRoute() {
  return (
    <>
      <Head>
        <title>Account · Trimsheet</title>
      </Head>
      <AccountScreen />
    </>
  );
}
