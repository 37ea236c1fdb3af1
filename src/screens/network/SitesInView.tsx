/**
 * The sites now on screen as a list of buttons (failure marks first, then by
 * households): the keyboard and screen-reader way to pick a site, and a
 * readable roll-call when the diagram is too dense for names.
 */
import { memo, useMemo } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { formatCount } from '@/shared/format';
import { StatusShape } from '@/src/components/StatusShape';
import { Capped } from '@/src/screens/reach/Capped';
import { colors, fonts, space, TOUCH_MIN, type } from '@/src/theme';
import { orderSitesInView, type DiagramSite, type SiteStatus } from './diagramModel';

/** Memoised: the screen re-renders on every pan and zoom step, and the list only changes with what was drawn. */
export const SitesInView = memo(function SitesInView({ sites, inView, statuses, onChoose }: { sites: DiagramSite[]; inView: number[]; statuses: ReadonlyMap<string, SiteStatus>; onChoose: (i: number) => void }) {
  const ordered = useMemo(() => orderSitesInView(sites, inView, statuses), [sites, inView, statuses]);
  return (
    <View style={styles.wrap} testID="network-sites-in-view">
      <Text style={styles.title}>{`Sites in view (${formatCount(inView.length)})`}</Text>
      {ordered.length === 0 ? (
        <Text style={styles.small}>No site is in view. Press Fit to see the whole network.</Text>
      ) : (
        <Capped
          items={ordered}
          what="sites in view"
          first={8}
          render={(i) => {
            const s = sites[i];
            const st = statuses.get(s.code);
            return (
              <Pressable key={s.code} accessibilityRole="button" onPress={() => onChoose(i)} style={({ pressed }) => [styles.row, pressed && styles.pressed]}>
                {st ? <StatusShape shape={st === 'off-air' ? 'cross' : 'half'} color={st === 'off-air' ? colors.bad : colors.warn} size={14} /> : null}
                <Text style={styles.name}>
                  {`${s.name} `}
                  <Text style={styles.code}>{s.code}</Text>
                  {st ? <Text style={styles.small}>{st === 'off-air' ? '  off air' : '  on reserve'}</Text> : null}
                </Text>
              </Pressable>
            );
          }}
        />
      )}
    </View>
  );
});

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  title: { ...type.label, fontSize: 17 },
  row: { minHeight: TOUCH_MIN, flexDirection: 'row', alignItems: 'center', gap: space.sm, paddingHorizontal: space.md, borderBottomWidth: 1, borderBottomColor: colors.line, backgroundColor: colors.surface },
  pressed: { backgroundColor: colors.accentSoft },
  name: { ...type.body, fontSize: 16, flex: 1 },
  code: { fontFamily: fonts.mono, fontSize: 14, color: colors.inkMuted },
  small: { ...type.small },
});
