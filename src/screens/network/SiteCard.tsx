/** The chosen site on the diagram: what it is, what it carries, its state under the failure set, and where to go next. */
import { Link, type Href } from 'expo-router';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import type { Element } from '@/shared/schemas/analysis';
import { StatusPill } from '@/src/components/Badge';
import { Button } from '@/src/components/Button';
import { Card } from '@/src/components/Card';
import { formatCount } from '@/shared/format';
import { formatFailSet } from '@/src/screens/reach/failSet';
import { LinkRow } from '@/src/screens/reach/LinkRow';
import { colors, fonts, radius, space, TOUCH_MIN, type } from '@/src/theme';
import type { DiagramSite, SiteStatus } from './diagramModel';

const ROLE_WORD = { origin: 'Origin', main: 'Main station', relay: 'Relay' } as const;

export function SiteCard({
  site,
  status,
  failed,
  onClose,
  overlayHref,
  onOverlay,
}: {
  site: DiagramSite;
  status: SiteStatus | undefined;
  failed: readonly Element[];
  onClose: () => void;
  overlayHref?: Href;
  /** called as the overlay link is followed (the screen asks for the reach then) */
  onOverlay?: () => void;
}) {
  const withThis = formatFailSet([...failed, { kind: 'site', code: site.code }]);
  const alreadyFailed = failed.some((e) => e.kind === 'site' && e.code === site.code);
  return (
    <Card testID="network-site-card">
      <View style={styles.head}>
        <View style={styles.titles}>
          <Text style={styles.name}>{site.name}</Text>
          <Text style={styles.meta}>
            <Text style={styles.code}>{site.code}</Text>
            {`  ${ROLE_WORD[site.role]}${site.households != null ? `, ${formatCount(site.households)} households` : ''}`}
          </Text>
        </View>
        <Button label="Close" variant="quiet" icon="close" onPress={onClose} accessibilityLabel={`Close ${site.name}`} />
      </View>
      {failed.length > 0 ? <StatusPill status={status ?? 'on-air'} testID="network-site-status" /> : null}
      <Text style={styles.label}>{`Carriages (${site.carriages.length})`}</Text>
      <View style={styles.carriages}>
        {site.carriages.length === 0 ? <Text style={styles.meta}>None in this view.</Text> : null}
        {site.carriages.map((c) => (
          <Link key={c} href={`/carriages/${encodeURIComponent(c)}`} asChild>
            <Pressable accessibilityRole="link" style={styles.carriage}>
              <Text style={styles.carriageText}>{c}</Text>
            </Pressable>
          </Link>
        ))}
      </View>
      <View style={styles.links}>
        <LinkRow href={`/sites/${encodeURIComponent(site.code)}`} title="Open the site page" />
        {alreadyFailed ? null : (
          <LinkRow href={`/reach?fail=${withThis}`} title={failed.length > 0 ? 'Add this site to the failure set' : 'Fault reach if this site fails'} />
        )}
        {alreadyFailed || !overlayHref ? null : (
          <LinkRow href={overlayHref} title={failed.length > 0 ? 'Add it to the failure set shown here' : 'Show here what its failure takes off air'} testID="network-site-overlay" onPress={onOverlay} />
        )}
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  head: { flexDirection: 'row', alignItems: 'flex-start', gap: space.sm },
  titles: { flex: 1, gap: space.xxs },
  name: { ...type.heading },
  meta: { ...type.small },
  code: { fontFamily: fonts.mono, color: colors.ink },
  label: { ...type.label },
  carriages: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  carriage: { minHeight: TOUCH_MIN, justifyContent: 'center', paddingHorizontal: space.sm, borderWidth: 1, borderColor: colors.accent, borderRadius: radius.md },
  carriageText: { fontFamily: fonts.mono, fontSize: 14, color: colors.accent },
  links: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, overflow: 'hidden' },
});
