/**
 * The inventory's own small navigation: one link per kind of record and one
 * to import and export. The shell's "Inventory" entry opens /sites; these
 * links move between the six places from there. The current one is marked
 * by a bar, bold text and aria-current, not by colour alone.
 */
import { Link, type Href } from 'expo-router';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { webAria } from '@/src/components/webAria';
import { colors, fonts, radius, space, TOUCH_MIN } from '@/src/theme';

export type InventoryPlace = 'sites' | 'services' | 'carriages' | 'feeds' | 'groups' | 'import';

const PLACES: readonly { id: InventoryPlace; label: string; href: Href }[] = [
  { id: 'sites', label: 'Sites', href: '/sites' },
  { id: 'services', label: 'Services', href: '/services' },
  { id: 'carriages', label: 'Carriages', href: '/carriages' },
  { id: 'feeds', label: 'Feeds', href: '/feeds' },
  { id: 'groups', label: 'Groups', href: '/groups' },
  { id: 'import', label: 'Import / Export', href: '/import' },
];

export function InventoryNav({ current }: { current: InventoryPlace | null }) {
  return (
    <View role="navigation" aria-label="Inventory" testID="inventory-nav">
      <View style={styles.row}>
        {PLACES.map((p) => {
          const here = p.id === current;
          return (
            <Link key={p.id} href={p.href} asChild>
              <Pressable
                accessibilityRole="link"
                accessibilityLabel={p.label}
                {...webAria({ 'aria-current': here ? 'page' : undefined })}
                testID={`inventory-nav-${p.id}`}
                style={StyleSheet.flatten([styles.item, here && styles.itemHere])}
              >
                <Text style={[styles.label, here && styles.labelHere]}>{p.label}</Text>
              </Pressable>
            </Link>
          );
        })}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  // Wrapping rather than scrolling sideways keeps every place, and the current one, in view on a phone.
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  item: {
    minHeight: TOUCH_MIN,
    justifyContent: 'center',
    paddingHorizontal: space.md,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: colors.line,
    borderBottomWidth: 4,
    backgroundColor: colors.surface,
  },
  itemHere: { borderColor: colors.accent, backgroundColor: colors.accentSoft },
  label: { fontFamily: fonts.text, fontSize: 16, lineHeight: 22, color: colors.ink },
  labelHere: { fontFamily: fonts.textBold, color: colors.accent },
});
