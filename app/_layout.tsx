/**
 * Root layout: fonts, data cache and safe-area insets for every route.
 */
import { QueryClientProvider } from '@tanstack/react-query';
import { useFonts } from 'expo-font';
import { Slot } from 'expo-router';
import { useState } from 'react';
import { View } from 'react-native';
import { SafeAreaProvider, SafeAreaView } from 'react-native-safe-area-context';
import { fonts, palette } from '../components/ui/theme';
import { createAppQueryClient } from '../hooks/query-client';

const fontSources = {
  [fonts.body]: require('../public/fonts/Archivo_400Regular.ttf'),
  [fonts.bodyStrong]: require('../public/fonts/Archivo_600SemiBold.ttf'),
  [fonts.display]: require('../public/fonts/Archivo_800ExtraBold.ttf'),
  [fonts.mono]: require('../public/fonts/DMMono_400Regular.ttf'),
  [fonts.monoStrong]: require('../public/fonts/DMMono_500Medium.ttf'),
};

export default function RootLayout() {
  const [queryClient] = useState(createAppQueryClient);
  // A font that fails to load falls back to the system face; the app stays usable, so only wait while loading.
  const [loaded, fontError] = useFonts(fontSources);
  if (!loaded && !fontError) return <View style={{ flex: 1, backgroundColor: palette.paper }} />;
  return (
    <SafeAreaProvider>
      <QueryClientProvider client={queryClient}>
        <SafeAreaView style={{ flex: 1, backgroundColor: palette.paper }}>
          <Slot />
        </SafeAreaView>
      </QueryClientProvider>
    </SafeAreaProvider>
  );
}
