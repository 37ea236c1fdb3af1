/**
 * Finds a site by code or name (GET /api/sites?q=) and hands back its position and heights.
 * Results are buttons, 44 px high, so picking works by touch as well as by keyboard.
 */
import { useState } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { useSitePositions } from '@/src/api/queries/checks';
import type { SitePosition } from '@/src/api/schemas';
import { ErrorState } from '@/src/components/states';
import { colors, fonts, radius, space, TOUCH_MIN, type } from '@/src/theme';
import { TextField } from '@/src/components/TextField';
import { useDebounced } from '@/src/hooks/useDebounced';

export function SitePicker({ end, onPick }: { end: string; onPick: (site: SitePosition) => void }) {
  const [text, setText] = useState('');
  const q = useDebounced(text, 300);
  const search = useSitePositions(q);
  const items = search.data?.items ?? [];
  const waiting = text.trim() !== '' && (q !== text || (!search.data && !search.error));

  return (
    <View style={styles.wrap}>
      <TextField
        label={`Find a site for end ${end}`}
        value={text}
        onChangeText={setText}
        hint="Code or name; or type the position below"
        autoCapitalize="none"
        autoCorrect={false}
        testID={`calc-site-search-${end}`}
      />
      {search.error && text.trim() ? (
        <ErrorState what="the site list" error={search.error} onRetry={() => void search.mutate()} />
      ) : text.trim() === '' ? null : waiting ? (
        <Text style={styles.muted}>Searching…</Text>
      ) : items.length === 0 ? (
        <Text style={styles.muted}>{`No site matches "${q.trim()}".`}</Text>
      ) : (
        <>
          <View style={styles.list} role="list" aria-label={`Sites matching ${q.trim()}`}>
            {items.map((s) => (
              <View key={s.code} role="listitem">
                <Pressable
                  accessibilityRole="button"
                  // The name starts with the visible text, so speech input can say what it sees.
                  accessibilityLabel={`${s.name} ${s.code}, use as end ${end}`}
                  onPress={() => {
                    onPick(s);
                    setText('');
                  }}
                  style={({ pressed }) => [styles.item, pressed && styles.pressed]}
                  testID={`calc-site-${end}-${s.code}`}
                >
                  <Text style={styles.name}>{s.name}</Text>
                  <Text style={styles.code}>{` ${s.code}`}</Text>
                </Pressable>
              </View>
            ))}
          </View>
          {search.data && search.data.total > items.length ? <Text style={styles.more}>{`${search.data.total - items.length} more: type more of the name`}</Text> : null}
        </>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  list: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, overflow: 'hidden', backgroundColor: colors.surface },
  item: { minHeight: TOUCH_MIN, flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.md, paddingHorizontal: space.md, borderBottomWidth: 1, borderBottomColor: colors.line },
  pressed: { backgroundColor: colors.accentSoft },
  name: { ...type.body, fontSize: 16, flexShrink: 1 },
  code: { fontFamily: fonts.mono, fontSize: 15, color: colors.inkMuted },
  muted: { ...type.small },
  more: { ...type.small, padding: space.sm },
});
