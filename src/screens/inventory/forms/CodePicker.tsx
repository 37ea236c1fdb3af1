/**
 * A searchable picker for a record's code: type part of a code or name and
 * choose from the matches below the field (each a row at least 44 px high,
 * so a thumb hits it on a phone). On a desktop the keyboard works too: the
 * arrow keys move through the matches, Enter takes the marked one (the first
 * when none is marked), Escape closes the list, and Tab reaches each row.
 * What is typed stays the value, so a known code can still be entered as text.
 *
 * Sources: sites, services, groups and carriages by search (GET /api/<kind>?q=),
 * and for a feed's source carriage the carriages that could feed the
 * receiving one, nearest first with distance and bearing
 * (GET /api/carriages/:code/sources).
 */
import { useEffect, useRef, useState } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { api } from '@/shared/api';
import { formatBearing, formatKm } from '@/shared/format';
import { useInventoryList } from '@/src/api/queries/inventory';
import { useSourceCarriages } from '@/src/api/queries/recordTools';
import { TextField } from '@/src/components/TextField';
import { colors, fonts, radius, space, TOUCH_MIN, type } from '@/src/theme';

export type PickerSource = { kind: 'sites' | 'services' | 'groups' | 'carriages' } | { kind: 'sources'; carriage: string | null };

export interface PickerOption {
  code: string;
  title: string;
  detail?: string;
}

const SHOWN = 8;
const searchPath = (kind: string, q: string) => `${api.list(kind)}?page=1&pageSize=${SHOWN}&sort=code&order=asc${q ? `&q=${encodeURIComponent(q)}` : ''}`;

/** The matches for `q` from the source; the nearest-first list when the receiving carriage is known. */
export function usePickerOptions(source: PickerSource, q: string, active: boolean): { options: PickerOption[]; nearest: boolean; loading: boolean } {
  const text = q.trim();
  const sourcesOf = source.kind === 'sources' && active ? source.carriage : null;
  const sources = useSourceCarriages(sourcesOf, text);
  const nearest = !!sourcesOf && !!sources.data;
  const listKind = source.kind === 'sources' ? 'carriages' : source.kind;
  // The plain search also stands in while the nearest-first list is not there (no receiving carriage yet, or an unknown one).
  const list = useInventoryList(listKind, active && !nearest ? searchPath(listKind, text) : null);
  if (nearest) {
    return {
      nearest,
      loading: false,
      options: sources.data!.items.slice(0, SHOWN).map((s) => ({
        code: s.carriage,
        title: s.siteName,
        detail: `${formatKm(s.distanceKm)}, bearing ${formatBearing(s.bearingDeg)} from the receiving site`,
      })),
    };
  }
  const items = (list.data?.items ?? []) as unknown as Array<Record<string, unknown>>;
  const options = items.map((r) => {
    const code = String(r.code);
    if (listKind === 'carriages') return { code, title: `${String(r.service)} at ${String(r.site)}` };
    if (listKind === 'services') return { code, title: String(r.name), detail: String(r.kind) };
    if (listKind === 'sites') return { code, title: String(r.name), detail: String(r.role) };
    return { code, title: String(r.name) };
  });
  return { options, nearest: false, loading: active && !list.data && !list.error };
}

export interface CodePickerProps {
  label: string;
  value: string;
  onChange: (code: string) => void;
  onLeave: () => void;
  source: PickerSource;
  error?: string;
  hint?: string;
  editable?: boolean;
  testID: string;
  /** called with the chosen code when a match is picked (a list picker adds it and clears the field) */
  onPick?: (code: string) => void;
  /** codes not offered (already in a list) */
  exclude?: readonly string[];
}

export function CodePicker({ label, value, onChange, onLeave, source, error, hint, editable = true, testID, onPick, exclude }: CodePickerProps) {
  const [open, setOpen] = useState(false);
  const [marked, setMarked] = useState(-1);
  const closing = useRef<ReturnType<typeof setTimeout> | null>(null);
  const { options: found, nearest, loading } = usePickerOptions(source, value, open && editable);
  const options = exclude ? found.filter((o) => !exclude.includes(o.code)) : found;
  useEffect(() => () => (closing.current ? clearTimeout(closing.current) : undefined), []);

  const keepOpen = () => {
    if (closing.current) clearTimeout(closing.current);
    closing.current = null;
  };
  const pick = (o: PickerOption) => {
    keepOpen();
    if (onPick) onPick(o.code);
    else onChange(o.code);
    setOpen(false);
    setMarked(-1);
    onLeave();
  };
  const listShown = open && editable && (options.length > 0 || loading || value.trim() !== '');

  return (
    <View style={styles.wrap}>
      <TextField
        label={label}
        value={value}
        onChangeText={(t) => {
          onChange(t);
          setOpen(true);
          setMarked(-1);
        }}
        onFocus={() => {
          keepOpen();
          setOpen(true);
        }}
        // Closing waits a moment, so a press on a match (which moves focus first) still lands.
        onBlur={() => {
          closing.current = setTimeout(() => {
            setOpen(false);
            onLeave();
          }, 300);
        }}
        onKeyPress={(e) => {
          const key = (e.nativeEvent as { key?: string }).key;
          if (key === 'ArrowDown') setMarked((m) => Math.min(m + 1, options.length - 1));
          else if (key === 'ArrowUp') setMarked((m) => Math.max(m - 1, 0));
          else if (key === 'Escape') setOpen(false);
          else return;
          e.preventDefault?.();
        }}
        onSubmitEditing={() => {
          const o = options[marked >= 0 ? marked : 0];
          if (o && open) pick(o);
        }}
        error={error}
        hint={hint}
        editable={editable}
        mono
        autoCapitalize="none"
        autoCorrect={false}
        testID={testID}
      />
      {listShown ? (
        <View style={styles.list} accessibilityRole="list" accessibilityLabel={`Matches for ${label}`} testID={`${testID}-options`}>
          {nearest ? <Text style={styles.note}>Nearest first</Text> : null}
          {options.map((o, i) => (
            <Pressable
              key={o.code}
              onPress={() => pick(o)}
              onPressIn={keepOpen}
              onFocus={keepOpen}
              accessibilityRole="button"
              accessibilityLabel={`Pick ${o.code}, ${o.title}${o.detail ? `, ${o.detail}` : ''}`}
              style={({ pressed }) => [styles.option, (pressed || i === marked) && styles.marked]}
              testID={`${testID}-option`}
            >
              <Text style={styles.code}>{o.code}</Text>
              <Text style={styles.title}>{o.detail ? `${o.title} · ${o.detail}` : o.title}</Text>
            </Pressable>
          ))}
          {!loading && options.length === 0 ? <Text style={styles.note}>{`No match for "${value.trim()}".`}</Text> : null}
          {loading ? <Text style={styles.note}>Looking…</Text> : null}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  list: { borderWidth: 1, borderColor: colors.lineStrong, borderRadius: radius.md, backgroundColor: colors.surface, overflow: 'hidden' },
  option: { minHeight: TOUCH_MIN, paddingHorizontal: space.md, paddingVertical: space.sm, borderTopWidth: 1, borderTopColor: colors.line, justifyContent: 'center' },
  marked: { backgroundColor: colors.accentSoft },
  code: { fontFamily: fonts.monoBold, fontSize: 15, lineHeight: 20, color: colors.ink },
  title: { ...type.small },
  note: { ...type.small, paddingHorizontal: space.md, paddingVertical: space.sm },
});
