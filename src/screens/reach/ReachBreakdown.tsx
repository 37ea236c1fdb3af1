/**
 * Where a failure bites: per service, per site, and the carriages themselves.
 * Each row opens the place to act from: a service on the diagram with the
 * same failure set, a site's page, a carriage's chain.
 */
import { useMemo } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import type { ReachResult } from '@/src/api/queries/analysis';
import { countOf } from '@/shared/format';
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

const serviceKey = (s: { service: string }) => s.service;
const siteKey = (s: { site: string }) => s.site;
const plain = (c: string) => c;
/** A carriage row is one line of title in a 48 px row (LinkRow's minimum height). */
const CARRIAGE_ROW = 48;
const householdsWords = (n: number | undefined) => (n === undefined ? undefined : countOf(n, 'household'));

export function ReachBreakdown({ reach, failText, names }: { reach: ReachResult; failText: string; names: Names }) {
  const services = useMemo(() => [...reach.byService].sort((a, b) => b.lost - a.lost || b.fallback - a.fallback || a.service.localeCompare(b.service)), [reach]);
  const sites = useMemo(
    () =>
      // Off air before on reserve, then the most households first: the order a fault desk calls sites in.
      [...reach.sites].sort(
        (a, b) =>
          Number(b.lost.length > 0) - Number(a.lost.length > 0) ||
          (names.households(b.site) ?? 0) - (names.households(a.site) ?? 0) ||
          b.lost.length - a.lost.length ||
          a.site.localeCompare(b.site),
      ),
    [reach, names],
  );

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
            items={sites}
            what="sites"
            keyOf={siteKey}
            testID="reach-by-site-list"
            render={(s) => (
              <LinkRow
                key={s.site}
                href={`/sites/${encodeURIComponent(s.site)}`}
                title={names.site(s.site) ?? s.site}
                code={s.site}
                status={s.lost.length > 0 ? 'off-air' : 'on-reserve'}
                figure={householdsWords(names.households(s.site))}
                detail={[s.lost.length > 0 ? `off air: ${s.lost.join(', ')}` : null, s.fallback && s.fallback.length > 0 ? `on reserve: ${s.fallback.join(', ')}` : null].filter(Boolean).join('; ')}
              />
            )}
          />
        </Section>
      </Columns>

      <Section title="Carriages" note="Open a carriage to walk its chain." testID="reach-carriages">
        <Columns max={2}>
          <View style={styles.group}>
            <Text style={styles.groupTitle}>{`Off air (${reach.lost.length})`}</Text>
            {reach.lost.length === 0 ? (
              <Text style={styles.none}>None: every carriage keeps programme.</Text>
            ) : (
              <Capped items={reach.lost} what="carriages" keyOf={plain} rowHeight={CARRIAGE_ROW} testID="reach-lost-list" render={(c) => <LinkRow key={c} href={`/carriages/${encodeURIComponent(c)}`} title={c} status="off-air" />} />
            )}
          </View>
          <View style={styles.group}>
            <Text style={styles.groupTitle}>{`On reserve (${reach.fallback.length})`}</Text>
            {reach.fallback.length === 0 ? (
              <Text style={styles.none}>None: nothing runs on a reserve feed.</Text>
            ) : (
              <Capped items={reach.fallback} what="carriages" keyOf={plain} rowHeight={CARRIAGE_ROW} testID="reach-fallback-list" render={(c) => <LinkRow key={c} href={`/carriages/${encodeURIComponent(c)}`} title={c} status="on-reserve" />} />
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
