import { useLocalSearchParams } from 'expo-router';
import Head from 'expo-router/head';
import { SignInScreen } from '@/components/auth/sign-in-screen';

/** /sign-in, with the server's `?error=` code when a sign-in failed. */
export default function SignInRoute() {
  const { error } = useLocalSearchParams<{ error?: string | string[] }>();
  return (
    <>
      <Head>
        <title>Sign in · Trimsheet</title>
      </Head>
      <SignInScreen error={Array.isArray(error) ? error[0] : error} />
    </>
  );
}
