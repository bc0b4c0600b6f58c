import { useLocalSearchParams } from 'expo-router';
import { SheetScreen } from '@/components/sheet/sheet-screen';
import { PageTitle } from '@/components/ui/page-title';

/** /crafts/:craftId/sheet */
export default function CraftSheetRoute() {
  const { craftId } = useLocalSearchParams<{ craftId: string }>();
  return (
    <>
      <PageTitle title="Sheet" />
      <SheetScreen craftId={craftId} />
    </>
  );
}
