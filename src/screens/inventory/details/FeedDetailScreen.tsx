/**
 * A feed's page: its two ends (carriage and site), medium and role, the hops
 * it passes through and the groups it shares a risk with, the receive
 * details, a way to the receiving carriage's chain, and the feed's engineering
 * screening (FeedChecksPanel, which carries the screening and mast cautions).
 */
import { StyleSheet, View } from 'react-native';
import { Section } from '@/src/components/layout/Section';
import { FeedChecksPanel } from '@/src/screens/checks/FeedChecksPanel';
import { DocumentsPanel } from '@/src/screens/documents/DocumentsPanel';
import { useCanEditDocuments } from '../useCanEdit';
import { space } from '@/src/theme';
import { figure, whenText, withUnit } from '@/shared/format';
import { capitalised, feedRoleWord } from '@/shared/words';
import { detailHref } from '../kinds';
import { CodeLink } from '../parts/CodeLink';
import { FieldList } from '../parts/FieldList';
import { LinkButton } from '../parts/LinkButton';
import { DetailFrame } from './DetailFrame';
import { carriageNote, codeLinks, LinkList } from './RecordLinks';

function End({ carriage, site, testID }: { carriage: string; site?: { code: string; name: string }; testID: string }) {
  return (
    <View style={styles.end} testID={testID}>
      <CodeLink href={detailHref('carriages', carriage)} code={carriage} label={`Carriage ${carriage}`} testID={`${testID}-carriage`} />
      {site ? <CodeLink href={detailHref('sites', site.code)} code={site.code} note={site.name} testID={`${testID}-site`} /> : null}
    </View>
  );
}

export function FeedDetailScreen({ code }: { code: string }) {
  const canEditDocuments = useCanEditDocuments();
  return (
    <DetailFrame
      kind="feeds"
      code={code}
      title={(d) => `Feed ${d.feed.code}`}
      subtitle={(d) => `${capitalised(feedRoleWord(d.feed.role))} by ${d.feed.medium}, ${d.source.site?.code ?? d.feed.from} to ${d.target.site?.code ?? d.feed.to}`}
    >
      {({ feed, source, target, via }) => (
        <>
          <View style={styles.actions}>
            <LinkButton href={detailHref('carriages', feed.to)} label={`Chain of ${feed.to}`} testID="feed-chain" />
            <LinkButton href={`/reach?fail=${encodeURIComponent(`feed:${feed.code}`)}`} label="Fault reach" testID="feed-reach" />
          </View>
          <Section title="Record" testID="feed-record">
            <FieldList
              items={[
                { label: 'Code', value: feed.code, mono: true },
                { label: 'Medium', value: feed.medium },
                { label: 'Main or reserve', value: feedRoleWord(feed.role) },
                { label: 'Source carriage and site', value: <End carriage={feed.from} site={source.site} testID="feed-from" /> },
                { label: 'Receiving carriage and site', value: <End carriage={feed.to} site={target.site} testID="feed-to" /> },
                {
                  label: 'Via sites',
                  value: <LinkList items={via.length ? via.map((s) => ({ code: s.code, href: detailHref('sites', s.code), note: s.name })) : codeLinks('sites', feed.via ?? [])} empty="none: a direct path" testID="feed-via" />,
                },
                { label: 'Shared-risk groups', value: <LinkList items={codeLinks('groups', feed.groups ?? [])} empty="none" testID="feed-groups" /> },
                { label: 'What the source radiates', value: source.carriage ? carriageNote(source.carriage) : 'not found', mono: true },
                { label: 'Receive frequency', value: withUnit(feed.rxFrequencyMHz, 'MHz', 3), mono: true },
                { label: 'Receive channel', value: feed.rxChannel ?? '—', mono: true },
                { label: 'Receive antenna', value: feed.rxAntenna ?? '—' },
                { label: 'Recorded bearing', value: feed.bearingDeg === undefined ? '—' : `${figure(feed.bearingDeg, 1)}° from true north`, mono: true },
                { label: 'Last changed', value: `${whenText(feed.updatedAt)} (version ${feed.version})` },
              ]}
            />
          </Section>
          <FeedChecksPanel code={feed.code} />
          <DocumentsPanel kind="feeds" code={feed.code} canEdit={canEditDocuments} />
        </>
      )}
    </DetailFrame>
  );
}

const styles = StyleSheet.create({
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  end: { gap: 0 },
});
