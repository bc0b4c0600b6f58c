import { Stack, useLocalSearchParams } from 'expo-router';
import { CraftScreen } from '@/components/crafts/craft-screen';

/** /crafts/:craftId */
export default function CraftRoute() {
  const { craftId } = useLocalSearchParams<{ craftId: string }>();
  return (
    <>
      <Stack.Screen options={{ title: 'Craft · Trimsheet' }} />
      <CraftScreen craftId={craftId} />
    </>
  );
}
