/**
 * The frame of every screen inside the shell: a scrolling page whose content
 * sits in a centred column no wider than CONTENT_MAX_PX, with padding that
 * grows on wide windows. Screens never set their own outer width or padding.
 *
 *   <Screen title="People" subtitle="Who may sign in" actions={<Button .../>}>
 *     <Section title="...">...</Section>
 *   </Screen>
 */
import Head from 'expo-router/head';
import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, Text, View } from 'react-native';
import { CONTENT_MAX_PX } from '@/src/breakpoints';
import { useBreakpoints } from '@/src/hooks/useBreakpoints';
import { colors, space, type } from '@/src/theme';
import { heading } from '../webAria';

export interface ScreenProps {
  /** The page heading and the browser tab title. */
  title: string;
  subtitle?: string;
  /** Buttons shown beside the title on wide windows, under it on a phone. */
  actions?: ReactNode;
  children?: ReactNode;
  testID?: string;
}

export function Screen({ title, subtitle, actions, children, testID }: ScreenProps) {
  const { wide } = useBreakpoints();
  return (
    <ScrollView
      style={styles.scroll}
      contentContainerStyle={[styles.content, { padding: wide ? space.xxl : space.lg }]}
      keyboardShouldPersistTaps="handled"
      testID={testID}
    >
      <Head>
        <title>{`${title} · Headwater`}</title>
      </Head>
      <View style={styles.column}>
        <View style={[styles.header, wide && styles.headerWide]}>
          <View style={styles.titles}>
            <Text style={styles.title} {...heading(1)}>
              {title}
            </Text>
            {subtitle ? <Text style={styles.subtitle}>{subtitle}</Text> : null}
          </View>
          {actions ? <View style={styles.actions}>{actions}</View> : null}
        </View>
        {children}
      </View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  scroll: { flex: 1, backgroundColor: colors.canvas },
  content: { alignItems: 'center', flexGrow: 1 },
  column: { width: '100%', maxWidth: CONTENT_MAX_PX, gap: space.xl },
  header: { gap: space.md },
  headerWide: { flexDirection: 'row', alignItems: 'flex-end', justifyContent: 'space-between' },
  titles: { gap: space.xs, flexShrink: 1 },
  title: { ...type.title },
  subtitle: { ...type.small, fontSize: 16 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
