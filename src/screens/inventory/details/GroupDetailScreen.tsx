/**
 * A shared-risk group's page: what it is, and the sites and feeds in it
 * (they all fail together), with a way to its fault reach.
 */
import { StyleSheet, View } from 'react-native';
import { Columns } from '@/src/components/layout/Columns';
import { Section } from '@/src/components/layout/Section';
import { space } from '@/src/theme';
import { whenText } from '@/shared/format';
import { FieldList } from '../parts/FieldList';
import { LinkButton } from '../parts/LinkButton';
import { DetailFrame } from './DetailFrame';
import { codeLinks, LinkList } from './RecordLinks';

export function GroupDetailScreen({ code }: { code: string }) {
  return (
    <DetailFrame kind="groups" code={code} title={(d) => d.group.name} subtitle={(d) => `Shared-risk group ${d.group.code}`}>
      {({ group, members }) => (
        <>
          <View style={styles.actions}>
            <LinkButton href={`/reach?fail=${encodeURIComponent(`group:${group.code}`)}`} label="Fault reach" testID="group-reach" />
          </View>
          <Section title="Record" testID="group-record">
            <FieldList
              items={[
                { label: 'Code', value: group.code, mono: true },
                { label: 'Name', value: group.name },
                { label: 'Note', value: group.note ?? '—' },
                { label: 'Last changed', value: `${whenText(group.updatedAt)} (version ${group.version})` },
              ]}
            />
          </Section>
          <Columns max={2}>
            <Section title={`Sites in it (${members.sites.length})`} testID="group-sites">
              <LinkList items={codeLinks('sites', members.sites)} empty="No site is in this group." testID="group-site-links" />
            </Section>
            <Section title={`Feeds in it (${members.feeds.length})`} testID="group-feeds">
              <LinkList items={codeLinks('feeds', members.feeds)} empty="No feed is in this group." testID="group-feed-links" />
            </Section>
          </Columns>
        </>
      )}
    </DetailFrame>
  );
}

const styles = StyleSheet.create({
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
