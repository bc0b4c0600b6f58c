import { WhatIfScreen } from '@/components/sizing/what-if-screen';
import { PageTitle } from '@/components/ui/page-title';

/** /what-if: sizing on the square-sail template, in the browser, nothing saved. */
export default function WhatIfRoute() {
  return (
    <>
      <PageTitle title="Sizing sandbox" />
      <WhatIfScreen />
    </>
  );
}
