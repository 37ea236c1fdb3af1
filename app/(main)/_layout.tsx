/**
 * Everything behind sign-in. Waits for the stored session to be read, sends
 * a signed-out visitor to /sign-in (remembering where they were going, so a
 * shared link still works after signing in), and otherwise draws the shell.
 */
import { Redirect, useGlobalSearchParams, usePathname, useSegments } from 'expo-router';
import { useEffect, useRef } from 'react';
import { StyleSheet, View } from 'react-native';
import { SessionCache } from '@/src/api/ApiProvider';
import { AppShell } from '@/src/components/nav/AppShell';
import { LoadingState } from '@/src/components/states';
import { OfflineProvider } from '@/src/offline/OfflineProvider';
import { openedAt, queryFromParams, signInHref } from '@/src/session/nextPath';
import { useSession } from '@/src/session/SessionProvider';
import { colors } from '@/src/theme';

export default function SignedInLayout() {
  const session = useSession();
  const pathname = usePathname();
  const params = useGlobalSearchParams();
  const segments = useSegments();
  const here = `${pathname}${queryFromParams(params, segments)}`;
  // Where the person was while signed in. Once the shell (and the group's
  // navigator inside it) unmounts on sign-out, usePathname reads "/", so the
  // place to come back to is remembered here.
  const lastPlace = useRef<string | null>(null);
  useEffect(() => {
    if (session.status === 'signedIn') lastPlace.current = here;
  });

  if (session.status === 'restoring') {
    return (
      <View style={styles.wait}>
        <LoadingState what="your session" />
      </View>
    );
  }
  if (session.status === 'signedOut') {
    // After choosing to sign out there is nothing to come back to. Never signed
    // in on this page: back to the address it was opened at (see openedAt).
    const href = session.lastSignOut === 'chosen' ? '/sign-in' : signInHref(lastPlace.current ?? openedAt ?? here);
    return <Redirect href={href} />;
  }
  return (
    <SessionCache>
      <OfflineProvider>
        <AppShell />
      </OfflineProvider>
    </SessionCache>
  );
}

const styles = StyleSheet.create({
  wait: { flex: 1, alignItems: 'center', justifyContent: 'center', backgroundColor: colors.canvas },
});
