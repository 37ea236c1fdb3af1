/**
 * A list's search box, sort and filters. The search applies a moment after
 * typing stops (or at once on Enter); sort and filters apply when chosen.
 * On a phone the sort and filters fold away behind one button that says how
 * many are set, so the records stay near the top of the screen.
 */
import { useEffect, useRef, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { EntityKind } from '@/shared/schemas/network';
import { Button } from '@/src/components/Button';
import { Choice } from '@/src/components/Choice';
import { TextField } from '@/src/components/TextField';
import { useBreakpoints } from '@/src/hooks/useBreakpoints';
import { space } from '@/src/theme';
import { FILTERS, SEARCH_HINT, SORTS } from '../kinds';
import type { ListState } from '../listQuery';

/** How long typing must pause before the search runs (common practice, no source). */
const SEARCH_PAUSE_MS = 350;
const ANY = '__any';

export interface ListControlsProps {
  kind: EntityKind;
  state: ListState;
  /** service codes for the service filter */
  services: readonly string[];
  onChange: (next: ListState) => void;
}

export function ListControls({ kind, state, services, onChange }: ListControlsProps) {
  const { wide } = useBreakpoints();
  const [text, setText] = useState(state.q);
  const [open, setOpen] = useState(false);
  const latest = useRef({ state, onChange });
  latest.current = { state, onChange };

  // The URL may change the search from outside (back button, a link).
  useEffect(() => setText(state.q), [state.q]);

  useEffect(() => {
    if (text.trim() === latest.current.state.q.trim()) return;
    const timer = setTimeout(() => latest.current.onChange({ ...latest.current.state, q: text, page: 1 }), SEARCH_PAUSE_MS);
    return () => clearTimeout(timer);
  }, [text]);

  const setFilter = (name: string, value: string) => {
    const filters = { ...state.filters };
    if (value === ANY) delete filters[name];
    else filters[name] = value;
    onChange({ ...state, filters, page: 1 });
  };

  const set = FILTERS[kind].filter((f) => state.filters[f.name]).length + (state.sort !== 'code' || state.order !== 'asc' ? 1 : 0);
  const showOptions = wide || open;

  return (
    <View style={styles.wrap} testID="list-controls">
      <TextField
        label="Search"
        value={text}
        onChangeText={setText}
        placeholder={SEARCH_HINT[kind]}
        onSubmitEditing={() => onChange({ ...state, q: text, page: 1 })}
        returnKeyType="search"
        autoCapitalize="none"
        autoCorrect={false}
        testID="list-search"
        role="searchbox"
      />
      {!wide ? (
        <Button
          label={open ? 'Hide sort and filters' : `Sort and filters${set ? ` (${set} set)` : ''}`}
          variant="secondary"
          onPress={() => setOpen((o) => !o)}
          testID="list-options-toggle"
          style={styles.toggle}
        />
      ) : null}
      {showOptions ? (
        <View style={[styles.options, wide && styles.optionsWide]}>
          <Choice label="Sort by" options={SORTS[kind]} value={state.sort} onChange={(sort) => onChange({ ...state, sort, page: 1 })} testID="list-sort" />
          <Choice
            label="Order"
            options={[
              { value: 'asc', label: 'Ascending' },
              { value: 'desc', label: 'Descending' },
            ]}
            value={state.order}
            onChange={(order) => onChange({ ...state, order, page: 1 })}
            testID="list-order"
          />
          {FILTERS[kind].map((f) => {
            const values = f.values ?? services;
            if (values.length === 0) return null;
            return (
              <Choice
                key={f.name}
                label={f.label}
                options={[{ value: ANY, label: 'any' }, ...values.map((v) => ({ value: v, label: f.valueLabels?.[v] ?? v }))]}
                value={state.filters[f.name] ?? ANY}
                onChange={(v) => setFilter(f.name, v)}
                testID={`list-filter-${f.name}`}
              />
            );
          })}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  toggle: { alignSelf: 'flex-start' },
  options: { gap: space.md },
  optionsWide: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.xl, rowGap: space.md },
});
