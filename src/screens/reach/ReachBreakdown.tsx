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
  service: (code: string) => string | undefined;
}

export function ReachBreakdown({ reach, failText, names }: { reach: ReachResult; failText: string; names: Names }) {
  const services = useMemo(() => [...reach.byService].sort((a, b) => b.lost - a.lost || b.fallback - a.fallback || a.service.localeCompare(b.service)), [reach]);
  const sites = useMemo(
    () =>
      [...reach.sites].sort(
        (a, b) => b.lost.length - a.lost.length || (b.fallback?.length ?? 0) - (a.fallback?.length ?? 0) || a.site.localeCompare(b.site),
      ),
    [reach],
  );

  return (
    <>
      <Columns max={2}>
        <Section title="By service" note="Carriages off air and on reserve in each service. Open one to see it on the network diagram." testID="reach-by-service">
          <Capped
            items={services}
            what="services"
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

        <Section title="By site" note="Households are counted once per site: a site with any carriage off air counts as off air." testID="reach-by-site">
          <Capped
            items={sites}
            what="sites"
            render={(s) => (
              <LinkRow
                key={s.site}
                href={`/sites/${encodeURIComponent(s.site)}`}
                title={names.site(s.site) ?? s.site}
                code={s.site}
                status={s.lost.length > 0 ? 'off-air' : 'on-reserve'}
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
              <Capped items={reach.lost} what="carriages" render={(c) => <LinkRow key={c} href={`/carriages/${encodeURIComponent(c)}`} title={c} status="off-air" />} />
            )}
          </View>
          <View style={styles.group}>
            <Text style={styles.groupTitle}>{`On reserve (${reach.fallback.length})`}</Text>
            {reach.fallback.length === 0 ? (
              <Text style={styles.none}>None: nothing runs on a reserve feed.</Text>
            ) : (
              <Capped items={reach.fallback} what="carriages" render={(c) => <LinkRow key={c} href={`/carriages/${encodeURIComponent(c)}`} title={c} status="on-reserve" />} />
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
