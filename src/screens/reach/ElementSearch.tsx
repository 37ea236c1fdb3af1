/**
 * "Find a site, carriage, feed or group": type part of a code or name (a
 * carriage also by its site and service together), press a result
 * to add it to the failure set. Results say their kind in words; elements
 * already in the set say so instead of offering to add them again.
 */
import { useState } from 'react';
import { ActivityIndicator, Platform, Pressable, StyleSheet, Text, View } from 'react-native';
import type { Element } from '@/shared/schemas/analysis';
import { useElementSearch, type ElementHit } from '@/src/api/queries/elementSearch';
import { describeError } from '@/src/components/states';
import { TextField } from '@/src/components/TextField';
import { colors, fonts, radius, space, TOUCH_MIN, type } from '@/src/theme';
import { useDebounced } from '@/src/hooks/useDebounced';

/** Web only: the browser must not break a code or a tag inside a word. */
const noWrap = (Platform.OS === 'web' ? { whiteSpace: 'nowrap' } : {}) as object;

const KIND_WORD: Record<Element['kind'], string> = { site: 'site', carriage: 'carriage', feed: 'feed', group: 'group' };

export function ElementSearch({ chosen, onAdd }: { chosen: readonly Element[]; onAdd: (e: Element) => void }) {
  const [text, setText] = useState('');
  const q = useDebounced(text, 200);
  const search = useElementSearch(q);
  const isChosen = (h: ElementHit) => chosen.some((e) => e.kind === h.kind && e.code === h.code);
  const typing = text.trim() !== q.trim();
  const hits = search.data?.hits ?? [];
  // Enter adds the only match, as a fault desk types a code and presses Enter.
  const addOnly = () => {
    const open = !typing && !search.isLoading ? hits.filter((h) => !isChosen(h)) : [];
    if (hits.length !== 1 || open.length !== 1) return;
    onAdd({ kind: open[0].kind, code: open[0].code });
    setText('');
  };

  return (
    <View style={styles.wrap}>
      <TextField
        label="Find a site, carriage, feed or group"
        hint="Part of a code or name; a carriage also by site and service; Enter adds the only match"
        value={text}
        onChangeText={setText}
        autoCapitalize="none"
        autoCorrect={false}
        returnKeyType="search"
        onSubmitEditing={addOnly}
        testID="reach-search"
      />
      {q.trim() === '' ? null : search.error ? (
        <Text style={styles.error} accessibilityRole="alert">
          {`Search failed: ${describeError(search.error)}`}
        </Text>
      ) : !search.data || typing || search.isLoading ? (
        <View style={styles.status}>
          <ActivityIndicator color={colors.accent} accessibilityLabel="Searching" />
          <Text style={styles.muted}>Searching…</Text>
        </View>
      ) : hits.length === 0 ? (
        <Text style={styles.muted} accessibilityLiveRegion="polite">{`Nothing matches "${q.trim()}".`}</Text>
      ) : (
        <View style={styles.results} accessibilityLabel="Search results" testID="reach-search-results">
          {hits.map((h) => {
            const already = isChosen(h);
            const name = `${KIND_WORD[h.kind]} ${h.code}${h.label ? `, ${h.label}` : ''}`;
            return (
              <Pressable
                key={`${h.kind}:${h.code}`}
                accessibilityRole="button"
                accessibilityLabel={already ? `Already failed: ${name}` : `Add ${name}`}
                accessibilityState={{ disabled: already }}
                disabled={already}
                onPress={() => {
                  onAdd({ kind: h.kind, code: h.code });
                  setText('');
                }}
                style={({ pressed }) => [styles.hit, pressed && styles.pressed, already && styles.already]}
              >
                <Text style={styles.kind}>{KIND_WORD[h.kind]}</Text>
                <View style={styles.hitTexts}>
                  <Text style={styles.code}>{h.code}</Text>
                  {h.label ? <Text style={styles.muted}>{h.label}</Text> : null}
                </View>
                <Text style={styles.action}>{already ? 'Failed' : '+ Add'}</Text>
              </Pressable>
            );
          })}
          <Totals totals={search.data.totals} shown={hits} />
        </View>
      )}
    </View>
  );
}

function Totals({ totals, shown }: { totals: Record<Element['kind'], number>; shown: ElementHit[] }) {
  const more = (Object.keys(totals) as Element['kind'][])
    .map((k) => ({ k, extra: totals[k] - shown.filter((h) => h.kind === k).length }))
    .filter((m) => m.extra > 0);
  if (more.length === 0) return null;
  return <Text style={styles.muted}>{`More match: ${more.map((m) => `${m.extra} ${KIND_WORD[m.k]}${m.extra === 1 ? '' : 's'}`).join(', ')}. Type more of the name to narrow.`}</Text>;
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  status: { flexDirection: 'row', gap: space.sm, alignItems: 'center', minHeight: TOUCH_MIN },
  results: { gap: space.xs },
  hit: {
    minHeight: TOUCH_MIN + 4,
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    paddingHorizontal: space.md,
    paddingVertical: space.xs,
    borderWidth: 1,
    borderColor: colors.line,
    borderRadius: radius.md,
    backgroundColor: colors.surface,
  },
  pressed: { backgroundColor: colors.accentSoft },
  already: { backgroundColor: colors.sunken },
  // The kind tag keeps its word whole ("GROUP" never splits): it grows to fit rather than wrapping.
  kind: { ...type.label, fontSize: 13, color: colors.inkMuted, minWidth: 44, flexShrink: 0, textTransform: 'uppercase', ...noWrap },
  hitTexts: { flex: 1 },
  code: { fontFamily: fonts.monoBold, fontSize: 16, lineHeight: 22, color: colors.ink },
  action: { ...type.label, color: colors.accent },
  muted: { ...type.small },
  error: { ...type.small, color: colors.bad, fontFamily: fonts.textBold },
});
