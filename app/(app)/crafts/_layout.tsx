import { Stack } from 'expo-router';

/** Crafts tab: the list and each craft in one stack, so the back gesture returns to the list. */
export default function CraftsLayout() {
  return <Stack screenOptions={{ headerShown: false }} />;
}
