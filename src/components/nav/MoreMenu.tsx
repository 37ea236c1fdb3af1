/**
 * The phone's "More" screen: the places that do not fit in the bottom tabs,
 * each with a line saying what it is for, and the account with sign-out.
 */
import { Link } from 'expo-router';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { useSession } from '@/src/session/SessionProvider';
import { colors, radius, space, TOUCH_MIN, type } from '@/src/theme';
import { Icon } from '../icons/Icon';
import { Screen } from '../layout/Screen';
import { Section } from '../layout/Section';
import { AccountPanel } from './AccountPanel';
import { destinationsFor } from './destinations';

export function MoreMenu() {
  const { user } = useSession();
  // On a wide window everything is in the side navigation already, but the
  // page still lists every place so a bookmarked /more is not a dead end.
  const places = destinationsFor(user?.role ?? null).filter((d) => d.id !== 'home');
  return (
    <Screen title="More">
      <Section title="Places">
        <View style={styles.list}>
          {places.map((d) => (
            <Link key={d.id} href={d.href} asChild>
              <Pressable accessibilityRole="link" testID={`more-${d.id}`} style={styles.item}>
                <Icon name={d.icon} color={colors.accent} />
                <View style={styles.texts}>
                  <Text style={styles.label}>{d.label}</Text>
                  <Text style={styles.blurb}>{d.blurb}</Text>
                </View>
              </Pressable>
            </Link>
          ))}
        </View>
      </Section>
      <Section title="Account">
        <View style={styles.account}>
          <AccountPanel compact />
        </View>
      </Section>
    </Screen>
  );
}

const styles = StyleSheet.create({
  list: { backgroundColor: colors.surface, borderRadius: radius.lg, borderWidth: 1, borderColor: colors.line, overflow: 'hidden' },
  item: {
    minHeight: TOUCH_MIN + 16,
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    paddingHorizontal: space.lg,
    paddingVertical: space.md,
    borderBottomWidth: 1,
    borderBottomColor: colors.line,
  },
  texts: { flex: 1, gap: space.xxs },
  label: { ...type.label, fontSize: 17 },
  blurb: { ...type.small },
  account: { backgroundColor: colors.surface, borderRadius: radius.lg, borderWidth: 1, borderColor: colors.line, padding: space.lg },
});
