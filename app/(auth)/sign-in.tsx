import { useLocalSearchParams } from 'expo-router';
import { SignInScreen } from '@/components/auth/sign-in-screen';
import { PageTitle } from '@/components/ui/page-title';

/** /sign-in, with the server's `?error=` code when a sign-in failed. */
export default function SignInRoute() {
  const { error } = useLocalSearchParams<{ error?: string | string[] }>();
  return (
    <>
      <PageTitle title="Sign in" />
      <SignInScreen error={Array.isArray(error) ? error[0] : error} />
    </>
  );
}
