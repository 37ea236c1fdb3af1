/** A carriage's particulars and the feeds into and out of it, each opening the carriage at its other end. */
import { StyleSheet, Text, View } from 'react-native';
import type { CarriageFeeds as CarriageFeedsAnswer } from '@/src/api/schemas';
import { FeedSwatch } from '@/src/components/charts/FeedSwatch';
import { feedWords } from '@/src/components/charts/feedStyle';
import { erpText, withUnit } from '@/shared/format';
import { capitalised, siteTypeWord } from '@/shared/words';
import { Columns } from '@/src/components/layout/Columns';
import { Card } from '@/src/components/Card';
import { Capped } from '@/src/screens/reach/Capped';
import { LinkRow } from '@/src/screens/reach/LinkRow';
import { colors, fonts, radius, space, type } from '@/src/theme';

type Feed = CarriageFeedsAnswer['feedsIn'][number];

function FeedRows({ feeds, end, empty }: { feeds: Feed[]; end: 'from' | 'to'; empty: string }) {
  if (feeds.length === 0) return <Text style={styles.none}>{empty}</Text>;
  const ordered = [...feeds].sort((a, b) => (a.role === b.role ? a.code.localeCompare(b.code) : a.role === 'main' ? -1 : 1));
  return (
    <Capped
      items={ordered}
      what="feeds"
      first={8}
      render={(f) => (
        <View key={f.code} style={styles.feed}>
          <View style={styles.swatch}>
            <FeedSwatch medium={f.medium} role={f.role} width={40} />
          </View>
          <View style={styles.feedLink}>
            <LinkRow href={`/carriages/${encodeURIComponent(f[end])}`} title={f[end]} detail={`${feedWords(f.medium, f.role)} ${f.code}`} />
          </View>
        </View>
      )}
    />
  );
}

function Fact({ label, value, text }: { label: string; value: string | null | undefined; text?: boolean }) {
  if (value === null || value === undefined || value === '') return null;
  return (
    <View style={styles.fact}>
      <Text style={styles.factLabel}>{label}</Text>
      <Text style={[styles.factValue, text && styles.factText]}>{value}</Text>
    </View>
  );
}

export function CarriageFacts({ detail }: { detail: CarriageFeedsAnswer }) {
  const c = detail.carriage;
  return (
    <Card testID="carriage-facts">
      <Fact label="Service" value={detail.service ? `${detail.service.name} (${c.service})` : c.service} text />
      <Fact label="Channel" value={c.channel} />
      <Fact label="Frequency" value={c.frequencyMHz != null ? withUnit(c.frequencyMHz, 'MHz', 3) : null} />
      <Fact label="ERP" value={c.erpW != null ? erpText(c.erpW) : null} />
      <Fact label="Polarisation" value={c.polarisation} />
      <View style={styles.siteLink}>
        <LinkRow href={`/sites/${encodeURIComponent(c.site)}`} title={detail.site ? detail.site.name : c.site} code={c.site} detail={detail.site ? capitalised(siteTypeWord(detail.site.role)) : 'site'} />
      </View>
    </Card>
  );
}

export function CarriageFeedLists({ detail }: { detail: CarriageFeedsAnswer }) {
  return (
    <Columns max={2}>
      <View style={styles.group}>
        <Text style={styles.groupTitle}>{`Feeds in (${detail.feedsIn.length})`}</Text>
        <FeedRows feeds={detail.feedsIn} end="from" empty="No feed comes in: the carriage is at an origin, or it has no source (unfed)." />
      </View>
      <View style={styles.group}>
        <Text style={styles.groupTitle}>{`Feeds out (${detail.feedsOut.length})`}</Text>
        <FeedRows feeds={detail.feedsOut} end="to" empty="Feeds no other carriage." />
      </View>
    </Columns>
  );
}

const styles = StyleSheet.create({
  feed: { flexDirection: 'row', alignItems: 'center', backgroundColor: colors.surface },
  swatch: { paddingLeft: space.sm },
  feedLink: { flex: 1 },
  none: { ...type.small },
  group: { gap: space.sm },
  groupTitle: { ...type.label, fontSize: 17 },
  fact: { flexDirection: 'row', justifyContent: 'space-between', gap: space.md, minHeight: 28, alignItems: 'baseline' },
  factLabel: { ...type.small },
  factValue: { fontFamily: fonts.mono, fontSize: 15, color: colors.ink, fontVariant: ['tabular-nums'], flexShrink: 1, textAlign: 'right' },
  factText: { fontFamily: fonts.text, fontSize: 16 },
  siteLink: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, overflow: 'hidden', marginTop: space.xs },
});
