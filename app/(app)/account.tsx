import { AccountScreen } from '@/components/account/account-screen';
import { PageTitle } from '@/components/ui/page-title';

/** /account */
export default function AccountRoute() {
  return (
    <>
      <PageTitle title="Account" />
      <AccountScreen />
    </>
  );
}
