/**
 * A carriage (docs/screens.md, Chain): what it is, its feeds, and its chain
 * upstream to the origins or downstream to everything it feeds.
 */
import { isApiError } from '@/src/api/client';
import { useCarriageFeeds } from '@/src/api/queries/carriageFeeds';
import { Screen } from '@/src/components/layout/Screen';
import { Section } from '@/src/components/layout/Section';
import { ErrorState, LoadingState } from '@/src/components/states';
import { CarriageEditButton, CarriageRecordFooter } from '@/src/screens/inventory/details/CarriageRecord';
import { LinkRow } from '@/src/screens/reach/LinkRow';
import { CarriageFacts, CarriageFeedLists } from './CarriageFeeds';
import { ChainSection } from './ChainSection';

export function CarriageChainScreen({ code, direction }: { code: string; direction: 'up' | 'down' }) {
  const detail = useCarriageFeeds(code);
  const d = detail.data;
  const missing = detail.error && isApiError(detail.error) && detail.error.status === 404;
  const subtitle = d ? `${d.service?.name ?? d.carriage.service} at ${d.site?.name ?? d.carriage.site}` : undefined;

  return (
    <Screen title={`Carriage ${code}`} subtitle={subtitle} actions={d ? <CarriageEditButton /> : undefined} testID="carriage-screen">
      {missing ? (
        <>
          <ErrorState what={`carriage ${code}`} error={detail.error} testID="carriage-missing" />
          <LinkRow href="/sites" title="Find it in the inventory" detail="It may have been renamed or removed" />
        </>
      ) : (
        <>
          <Section title="The carriage" testID="carriage-detail">
            {d ? (
              <CarriageFacts detail={d} />
            ) : detail.error ? (
              <ErrorState what={`carriage ${code}`} error={detail.error} onRetry={() => void detail.mutate()} />
            ) : (
              <LoadingState what={`carriage ${code}`} />
            )}
          </Section>
          <ChainSection code={code} direction={direction} />
          {d ? (
            <Section title="Feeds" note="Each opens the carriage at the feed's other end." testID="carriage-feeds">
              <CarriageFeedLists detail={d} />
            </Section>
          ) : null}
          {/* edit, history and delete, as on every record's page */}
          <CarriageRecordFooter code={code} />
        </>
      )}
    </Screen>
  );
}
