import { useLocalSearchParams } from 'expo-router';
import { SheetScreen } from '@/components/sheet/sheet-screen';
import { PageTitle } from '@/components/ui/page-title';

/** /crafts/:craftId/sheet, or /crafts/:craftId/sheet?revision=<id> for a study or a baseline */
export default function CraftSheetRoute() {
  const { craftId, revision } = useLocalSearchParams<{ craftId: string; revision?: string }>();
  return (
    <>
      <PageTitle title="Sheet" />
      <SheetScreen craftId={craftId} requestedRevisionId={revision} />
    </>
  );
}
