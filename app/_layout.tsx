import { Stack } from 'expo-router';
import { SessionGate } from '@/components/auth/session-gate';
import { AppProviders } from '@/components/ui/app-providers';

/** Root layout: providers, then one stack whose signed-in and signed-out halves are guarded by the session. */
export default function RootLayout() {
  return (
    <AppProviders>
      <SessionGate>
        {(signedIn) => (
          <Stack screenOptions={{ headerShown: false }}>
            <Stack.Protected guard={signedIn}>
              <Stack.Screen name="(app)" />
              <Stack.Screen name="index" />
            </Stack.Protected>
            <Stack.Protected guard={!signedIn}>
              <Stack.Screen name="(auth)/sign-in" />
            </Stack.Protected>
          </Stack>
        )}
      </SessionGate>
    </AppProviders>
  );
}
