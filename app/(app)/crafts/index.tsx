import { CraftListScreen } from '@/components/crafts/craft-list-screen';
import { PageTitle } from '@/components/ui/page-title';

/** /crafts */
export default function CraftsRoute() {
  return (
    <>
      <PageTitle title="Crafts" />
      <CraftListScreen />
    </>
  );
}
