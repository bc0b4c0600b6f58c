import { useLocalSearchParams } from 'expo-router';
import { CraftScreen } from '@/components/crafts/craft-screen';
import { PageTitle } from '@/components/ui/page-title';

/** /crafts/:craftId */
export default function CraftRoute() {
  const { craftId } = useLocalSearchParams<{ craftId: string }>();
  return (
    <>
      <PageTitle title="Craft" />
      <CraftScreen craftId={craftId} />
    </>
  );
}
