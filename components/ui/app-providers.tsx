import { Inter_400Regular } from '@expo-google-fonts/inter/400Regular';
import { Inter_500Medium } from '@expo-google-fonts/inter/500Medium';
import { Inter_600SemiBold } from '@expo-google-fonts/inter/600SemiBold';
import { Inter_700Bold } from '@expo-google-fonts/inter/700Bold';
import { RobotoMono_400Regular } from '@expo-google-fonts/roboto-mono/400Regular';
import { RobotoMono_500Medium } from '@expo-google-fonts/roboto-mono/500Medium';
import { QueryClientProvider } from '@tanstack/react-query';
import { useFonts } from 'expo-font';
import Head from 'expo-router/head';
import { useState, type ReactNode } from 'react';
import { SafeAreaProvider } from 'react-native-safe-area-context';
import { createQueryClient } from '@/components/api/query-client';
import { fonts } from './theme';

const fontFiles = {
  [fonts.regular]: Inter_400Regular,
  [fonts.medium]: Inter_500Medium,
  [fonts.semibold]: Inter_600SemiBold,
  [fonts.bold]: Inter_700Bold,
  [fonts.mono]: RobotoMono_400Regular,
  [fonts.monoMedium]: RobotoMono_500Medium,
};

/**
 * The app-wide providers: page head (titles), safe area, the one query client, and the fonts (each weight loaded from
 * its own file). Children wait for the fonts; if a font fails to load the system font stands in.
 */
export function AppProviders({ children }: { children: ReactNode }) {
  const [queryClient] = useState(() => createQueryClient());
  const [fontsLoaded, fontError] = useFonts(fontFiles);
  return (
    <Head.Provider>
      <SafeAreaProvider>
        <QueryClientProvider client={queryClient}>{fontsLoaded || fontError ? children : null}</QueryClientProvider>
      </SafeAreaProvider>
    </Head.Provider>
  );
}
