/**
 * A site's page: its record, the usual cautions before work on its mast, its
 * carriages (each opening its chain view), the feeds into and out of it and
 * those routed through it, and a way straight to "what does losing this
 * site take off air?".
 */
import { StyleSheet, View } from 'react-native';
import { Columns } from '@/src/components/layout/Columns';
import { Section } from '@/src/components/layout/Section';
import { MastCautions } from '@/src/screens/checks/MastCautions';
import { DocumentsPanel } from '@/src/screens/documents/DocumentsPanel';
import { space } from '@/src/theme';
import { householdsText, positionText, whenText, withUnit } from '@/shared/format';
import { siteTypeWord } from '@/shared/words';
import { filteredListHref } from '../listQuery';
import { FieldList } from '../parts/FieldList';
import { LinkButton } from '../parts/LinkButton';
import { useCanEdit, useCanEditDocuments } from '../useCanEdit';
import { DetailFrame } from './DetailFrame';
import { carriageLinks, codeLinks, feedLinks, LinkList } from './RecordLinks';

export function SiteDetailScreen({ code }: { code: string }) {
  const canEdit = useCanEdit();
  const canEditDocuments = useCanEditDocuments();
  return (
    <DetailFrame kind="sites" code={code} title={(d) => d.site.name} subtitle={(d) => `Site ${d.site.code}, ${siteTypeWord(d.site.role)}`}>
      {({ site, carriages, feedsIn, feedsOut, feedsVia }) => (
        <>
          <View style={styles.actions}>
            <LinkButton href={`/reach?fail=${encodeURIComponent(`site:${site.code}`)}`} label="Fault reach" testID="site-reach" />
          </View>
          {/* documents beside the record on a wide screen, under it on a phone */}
          <Columns max={2}>
            <Section title="Record" testID="site-record">
              <FieldList
                items={[
                  { label: 'Code', value: site.code, mono: true },
                  { label: 'Name', value: site.name },
                  { label: 'Site type', value: siteTypeWord(site.role) },
                  { label: 'Position (WGS84)', value: positionText(site.lat, site.lon), mono: true, testID: 'site-position' },
                  { label: 'Ground height (above sea level)', value: withUnit(site.groundHeightM, 'm'), mono: true },
                  { label: 'Mast height', value: withUnit(site.mastHeightM, 'm'), mono: true },
                  { label: 'Households served', value: householdsText(site.households) },
                  { label: 'Shared-risk groups', value: <LinkList items={codeLinks('groups', site.groups ?? [])} empty="none" testID="site-groups" /> },
                  { label: 'Last changed', value: `${whenText(site.updatedAt)} (version ${site.version})` },
                ]}
              />
            </Section>
            <DocumentsPanel kind="sites" code={site.code} canEdit={canEditDocuments} photos />
          </Columns>
          <MastCautions testID="site-mast-cautions" />
          <Section
            title={`Carriages (${carriages.length})`}
            note="Each opens its chain: where its programme comes from."
            aside={canEdit ? <LinkButton href={`/carriages?new=1&site=${encodeURIComponent(site.code)}`} label="Add carriage" testID="site-add-carriage" /> : undefined}
            testID="site-carriages"
          >
            <LinkList items={carriageLinks(carriages)} empty="No carriage is radiated from this site." testID="site-carriage-links" />
          </Section>
          <Columns max={2}>
            <Section title={`Feeds in (${feedsIn.length})`} testID="site-feeds-in">
              <LinkList items={feedLinks(feedsIn, 'from')} empty="No feed comes into this site." testID="site-feeds-in-links" />
              {feedsIn.length ? <LinkButton href={filteredListHref('feeds', { toSite: site.code })} label="As a list" /> : null}
            </Section>
            <Section title={`Feeds out (${feedsOut.length})`} testID="site-feeds-out">
              <LinkList items={feedLinks(feedsOut, 'to')} empty="No feed leaves this site." testID="site-feeds-out-links" />
              {feedsOut.length ? <LinkButton href={filteredListHref('feeds', { fromSite: site.code })} label="As a list" /> : null}
            </Section>
          </Columns>
          {feedsVia.length ? (
            <Section title={`Feeds routed via this site (${feedsVia.length})`} note="A hop on their path: they fail when this site does." testID="site-feeds-via">
              <LinkList items={feedLinks(feedsVia, 'to')} empty="" testID="site-feeds-via-links" />
            </Section>
          ) : null}
        </>
      )}
    </DetailFrame>
  );
}

const styles = StyleSheet.create({
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
