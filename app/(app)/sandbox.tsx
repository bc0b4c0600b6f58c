import { SandboxScreen } from '@/components/sizing/sandbox-screen';
import { PageTitle } from '@/components/ui/page-title';

/** /sandbox: sizing on the square-sail template, in the browser, nothing saved (the server sends /what-if here). */
export default function SandboxRoute() {
  return (
    <>
      <PageTitle title="Sizing sandbox" />
      <SandboxScreen />
    </>
  );
}
