import { Stack } from 'expo-router';
import { CraftListScreen } from '@/components/crafts/craft-list-screen';

/** /crafts */
export default function CraftsRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Crafts · Trimsheet' }} />
      <CraftListScreen />
    </>
  );
}
