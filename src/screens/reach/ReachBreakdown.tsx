/**
 * Where a failure bites: per service, per site, and the carriages themselves.
 * Each row opens the place to act from: a service on the diagram with the
 * same failure set, a site's page, a carriage's chain.
 */
import { useMemo, useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import type { Element } from '@/shared/schemas/analysis';
import { useReachCarriagePages, useReachSitePages, type BriefReachShown } from '@/src/api/queries/analysis';
import { countOf, formatCount } from '@/shared/format';
import { Columns } from '@/src/components/layout/Columns';
import { Section } from '@/src/components/layout/Section';
import { space, type } from '@/src/theme';
import { Capped } from './Capped';
import { LinkRow } from './LinkRow';

export interface Names {
  site: (code: string) => string | undefined;
  /** Households the site serves (undefined while unknown). */
  households: (code: string) => number | undefined;
  service: (code: string) => string | undefined;
}

/** A site the failure touches; a page from the server names it and counts its households itself. */
type SiteRow = { site: string; lost: string[]; fallback?: string[]; name?: string; households?: number };

const serviceKey = (s: { service: string }) => s.service;
const siteKey = (s: { site: string }) => s.site;
const plain = (c: string) => c;
const byCode = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);
/** A carriage row is one line of title in a 48 px row (LinkRow's minimum height). */
const CARRIAGE_ROW = 48;
const householdsWords = (n: number | undefined) => (n === undefined ? undefined : countOf(n, 'household'));

/**
 * What a long list shows: the answer's rows, or after "Show all" of a brief
 * answer (the server sent only its first rows and `counts`) the pages read so
 * far. The long list opens at once on the rows already here, and grows as the
 * pages arrive, so "Show all" never waits for the network.
 */
function useListPages<T>(firstRows: readonly T[], total: number, pages: { rows: T[]; loadMore: () => void }, showAll: boolean) {
  const paged = firstRows.length < total;
  return {
    items: paged && showAll && pages.rows.length > 0 ? pages.rows : firstRows,
    total,
    loadingAll: paged ? false : undefined,
    onEndReached: paged ? pages.loadMore : undefined,
  };
}

export function ReachBreakdown({ reach, failed, failText, names }: { reach: BriefReachShown; failed: readonly Element[]; failText: string; names: Names }) {
  const counts = reach.counts ?? { sites: reach.sites.length, lost: reach.lost.length, fallback: reach.fallback.length };
  const [allSites, setAllSites] = useState(false);
  const [allLost, setAllLost] = useState(false);
  const [allFallback, setAllFallback] = useState(false);
  // Pages are asked for only for a brief answer, and only once "Show all" is pressed.
  const sitePages = useReachSitePages(failed, failText, allSites && reach.sites.length < counts.sites);
  const lostPages = useReachCarriagePages(failed, failText, 'lost', allLost && reach.lost.length < counts.lost);
  const fallbackPages = useReachCarriagePages(failed, failText, 'fallback', allFallback && reach.fallback.length < counts.fallback);

  const services = useMemo(() => [...reach.byService].sort((a, b) => b.lost - a.lost || b.fallback - a.fallback || a.service.localeCompare(b.service)), [reach]);
  const firstSites = useMemo<SiteRow[]>(
    () =>
      // Off air before on reserve, then the most households first: the order a fault desk calls sites in (the server pages in the same order).
      [...reach.sites].sort(
        (a, b) =>
          Number(b.lost.length > 0) - Number(a.lost.length > 0) ||
          (names.households(b.site) ?? 0) - (names.households(a.site) ?? 0) ||
          b.lost.length - a.lost.length ||
          byCode(a.site, b.site),
      ),
    [reach, names],
  );
  const sites = useListPages<SiteRow>(firstSites, counts.sites, sitePages, allSites);
  const lost = useListPages(reach.lost, counts.lost, lostPages, allLost);
  const fallback = useListPages(reach.fallback, counts.fallback, fallbackPages, allFallback);

  return (
    <>
      <Columns max={2}>
        <Section title="By service" note="Carriages off air and on reserve in each service. Open one to see it on the network diagram." testID="reach-by-service">
          <Capped
            items={services}
            what="services"
            keyOf={serviceKey}
            testID="reach-by-service-list"
            render={(s) => (
              <LinkRow
                key={s.service}
                href={`/network?service=${encodeURIComponent(s.service)}&fail=${failText}`}
                title={names.service(s.service) ?? s.service}
                code={s.service}
                status={s.lost > 0 ? 'off-air' : 'on-reserve'}
                detail={[s.lost > 0 ? `${countOf(s.lost, 'carriage')} off air` : null, s.fallback > 0 ? `${countOf(s.fallback, 'carriage')} on reserve` : null].filter(Boolean).join(', ')}
              />
            )}
          />
        </Section>

        <Section title="By site" note="Households each site serves, off air first, then most households first. Households are counted once per site: a site with any carriage off air counts as off air." testID="reach-by-site">
          <Capped
            {...sites}
            what="sites"
            keyOf={siteKey}
            testID="reach-by-site-list"
            onShowAll={() => setAllSites(true)}
            render={(s) => (
              <LinkRow
                key={s.site}
                href={`/sites/${encodeURIComponent(s.site)}`}
                title={s.name ?? names.site(s.site) ?? s.site}
                code={s.site}
                status={s.lost.length > 0 ? 'off-air' : 'on-reserve'}
                figure={householdsWords(s.households ?? names.households(s.site))}
                detail={[s.lost.length > 0 ? `off air: ${s.lost.join(', ')}` : null, s.fallback && s.fallback.length > 0 ? `on reserve: ${s.fallback.join(', ')}` : null].filter(Boolean).join('; ')}
              />
            )}
          />
        </Section>
      </Columns>

      <Section title="Carriages" note="Open a carriage to walk its chain." testID="reach-carriages">
        <Columns max={2}>
          <View style={styles.group}>
            <Text style={styles.groupTitle}>{`Off air (${formatCount(counts.lost)})`}</Text>
            {counts.lost === 0 ? (
              <Text style={styles.none}>None: every carriage keeps programme.</Text>
            ) : (
              <Capped {...lost} onShowAll={() => setAllLost(true)} what="carriages" keyOf={plain} rowHeight={CARRIAGE_ROW} testID="reach-lost-list" render={(c) => <LinkRow key={c} href={`/carriages/${encodeURIComponent(c)}`} title={c} status="off-air" />} />
            )}
          </View>
          <View style={styles.group}>
            <Text style={styles.groupTitle}>{`On reserve (${formatCount(counts.fallback)})`}</Text>
            {counts.fallback === 0 ? (
              <Text style={styles.none}>None: nothing runs on a reserve feed.</Text>
            ) : (
              <Capped {...fallback} onShowAll={() => setAllFallback(true)} what="carriages" keyOf={plain} rowHeight={CARRIAGE_ROW} testID="reach-fallback-list" render={(c) => <LinkRow key={c} href={`/carriages/${encodeURIComponent(c)}`} title={c} status="on-reserve" />} />
            )}
          </View>
        </Columns>
      </Section>
    </>
  );
}

const styles = StyleSheet.create({
  group: { gap: space.sm },
  groupTitle: { ...type.label, fontSize: 17 },
  none: { ...type.small },
});
