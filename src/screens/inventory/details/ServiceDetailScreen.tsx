/**
 * A service's page: its record, how many carriages radiate it and feeds
 * carry it, and its carriages (each opening its chain view).
 */
import { Text } from 'react-native';
import { useInventoryList } from '@/src/api/queries/inventory';
import { Section } from '@/src/components/layout/Section';
import { ErrorState, LoadingState } from '@/src/components/states';
import { type } from '@/src/theme';
import { erpText, whenText, withUnit } from '@/shared/format';
import { serviceKindWord } from '@/shared/words';
import { countOf, detailHref } from '../kinds';
import { filteredListHref, listApiPath } from '../listQuery';
import { FieldList } from '../parts/FieldList';
import { LinkButton } from '../parts/LinkButton';
import { DetailFrame } from './DetailFrame';
import { LinkList } from './RecordLinks';

/** The most carriages listed on the page; the full list is one link away. */
const SHOWN = 200;

function ServiceCarriages({ service }: { service: string }) {
  const path = listApiPath('carriages', { q: '', page: 1, sort: 'site', order: 'asc', filters: { service } }, SHOWN);
  const list = useInventoryList('carriages', path);
  if (!list.data) {
    return list.error ? <ErrorState what={`the carriages of ${service}`} error={list.error} onRetry={() => void list.mutate()} /> : <LoadingState what={`the carriages of ${service}`} />;
  }
  const items = list.data.items.map((c) => ({
    code: c.code,
    href: detailHref('carriages', c.code),
    note: [`at ${c.site}`, c.channel ? `ch ${c.channel}` : null, c.frequencyMHz !== undefined ? withUnit(c.frequencyMHz, 'MHz', 3) : null, c.erpW !== undefined ? `ERP ${erpText(c.erpW)}` : null].filter(Boolean).join(', '),
  }));
  return (
    <>
      <LinkList items={items} empty="No site radiates this service yet." testID="service-carriage-links" />
      {list.data.total > items.length ? <Text style={type.small}>{`Showing ${items.length} of ${list.data.total}.`}</Text> : null}
    </>
  );
}

export function ServiceDetailScreen({ code }: { code: string }) {
  return (
    <DetailFrame kind="services" code={code} title={(d) => d.service.name} subtitle={(d) => `Service ${d.service.code}, ${serviceKindWord(d.service.kind)}`}>
      {({ service, counts }) => (
        <>
          <Section title="Record" testID="service-record">
            <FieldList
              items={[
                { label: 'Code', value: service.code, mono: true },
                { label: 'Name', value: service.name },
                { label: 'Kind', value: serviceKindWord(service.kind) },
                { label: 'Radiated by', value: countOf('carriages', counts.carriages), mono: true },
                { label: 'Carried by', value: countOf('feeds', counts.feeds), mono: true },
                { label: 'Last changed', value: `${whenText(service.updatedAt)} (version ${service.version})` },
              ]}
            />
          </Section>
          <Section
            title={`Carriages (${counts.carriages})`}
            note="Each opens its chain: where its programme comes from."
            aside={<LinkButton href={filteredListHref('feeds', { service: service.code })} label="Its feeds" testID="service-feeds" />}
            testID="service-carriages"
          >
            <ServiceCarriages service={service.code} />
            <LinkButton href={filteredListHref('carriages', { service: service.code })} label="As a list" />
          </Section>
        </>
      )}
    </DetailFrame>
  );
}
