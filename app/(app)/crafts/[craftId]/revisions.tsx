import { useLocalSearchParams } from 'expo-router';
import { RevisionsScreen } from '@/components/revisions/revisions-screen';
import { PageTitle } from '@/components/ui/page-title';

/** /crafts/:craftId/revisions */
export default function CraftRevisionsRoute() {
  const { craftId } = useLocalSearchParams<{ craftId: string }>();
  return (
    <>
      <PageTitle title="Revisions" />
      <RevisionsScreen craftId={craftId} />
    </>
  );
}
