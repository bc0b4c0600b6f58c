import { useLocalSearchParams } from 'expo-router';
import { AccountScreen } from '@/components/account/account-screen';
import { PageTitle } from '@/components/ui/page-title';

const first = (value: string | string[] | undefined) => (Array.isArray(value) ? value[0] : value);

/** /account, with `?link=<result>&provider=<provider>` when a request to link another sign-in came back. */
export default function AccountRoute() {
  const { link, provider } = useLocalSearchParams<{ link?: string | string[]; provider?: string | string[] }>();
  return (
    <>
      <PageTitle title="Account" />
      <AccountScreen linkResult={first(link)} linkProvider={first(provider)} />
    </>
  );
}
