import { AccountScreen } from '@/components/account/account-screen';

/** /account */
export default function AccountRoute() {
  return <AccountScreen />;
}
