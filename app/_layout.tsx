/**
 * Root of the app: loads the shipped fonts (fonts/, nothing fetched at run
 * time), restores the session, and provides the API/SWR layer. Routes decide
 * where to go only once the session has been read (see app/(main)/_layout.tsx
 * and app/sign-in.tsx).
 */
import { useFonts } from 'expo-font';
import { Slot } from 'expo-router';
import { StatusBar } from 'expo-status-bar';
import { StyleSheet, View } from 'react-native';
import { ApiProvider } from '@/src/api/ApiProvider';
import { SessionProvider } from '@/src/session/SessionProvider';
import { colors, FONT_NAMES } from '@/src/theme';
import { registerServiceWorker } from '@/src/offline/serviceWorker';
import { preloadDeferredScreens } from '@/src/screens/deferredRoute';
import { opensDeferredScreen } from '@/src/screens/deferredPaths';
import { opensNetworkDiagram, startDrawingEarly } from '@/src/api/queries/drawingEarly';
import { useEffect } from 'react';

export { RouteError as ErrorBoundary } from '@/src/components/RouteError';

// A page opened straight on a deferred screen starts that chunk's download now, beside the rest of start-up.
if (typeof window !== 'undefined' && typeof window.location?.pathname === 'string' && opensDeferredScreen(window.location.pathname)) preloadDeferredScreens();
// A page opened on the network diagram sends for its drawing now too (src/api/queries/drawingEarly.ts).
if (typeof window !== 'undefined' && typeof window.location?.pathname === 'string' && opensNetworkDiagram(window.location.pathname)) startDrawingEarly(window.localStorage, window);

export default function RootLayout() {
  const [loaded, fontError] = useFonts({
    [FONT_NAMES.text]: require('../fonts/AtkinsonHyperlegible_400Regular.ttf'),
    [FONT_NAMES.textBold]: require('../fonts/AtkinsonHyperlegible_700Bold.ttf'),
    [FONT_NAMES.mono]: require('../fonts/IBMPlexMono_400Regular.ttf'),
    [FONT_NAMES.monoBold]: require('../fonts/IBMPlexMono_600SemiBold.ttf'),
  });
  // A font that fails to load falls back to the system face (see theme); it
  // must not keep the app from starting. The routes stay mounted while fonts
  // load (only hidden): returning null here loses the deep link on the web,
  // which then opens at "/".
  const ready = loaded || !!fontError;
  useEffect(registerServiceWorker, []);

  return (
    <SessionProvider>
      <ApiProvider>
        <View style={[styles.root, !ready && styles.hidden]}>
          <StatusBar style="dark" />
          <Slot />
        </View>
      </ApiProvider>
    </SessionProvider>
  );
}

const styles = StyleSheet.create({
  root: { flex: 1, backgroundColor: colors.canvas },
  hidden: { opacity: 0 },
});
