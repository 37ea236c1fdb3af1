/**
 * Fault reach (docs/screens.md, Fault reach): mark sites, feeds or shared-risk
 * groups failed and see at once what goes off air and what survives on a
 * reserve. The failure set lives in the address (?fail=site:A,feed:B), so
 * the page can be shared, bookmarked and reloaded.
 */
import { useRouter } from 'expo-router';
import { useCallback, useMemo } from 'react';
import { ActivityIndicator, StyleSheet, Text, View } from 'react-native';
import type { Element } from '@/shared/schemas/analysis';
import { useBriefReach } from '@/src/api/queries/analysis';
import { useServiceNames } from '@/src/api/queries/serviceNames';
import { isApiError } from '@/src/api/client';
import { Button } from '@/src/components/Button';
import { Screen } from '@/src/components/layout/Screen';
import { Section } from '@/src/components/layout/Section';
import { EmptyState, ErrorState, LoadingState } from '@/src/components/states';
import { WarningBox } from '@/src/components/WarningBox';
import { colors, radius, space, type } from '@/src/theme';
import { CopyLinkButton } from './CopyLinkButton';
import { ElementSearch } from './ElementSearch';
import { addToFailSet, formatFailSet, parseFailSet, removeFromFailSet, unknownFromDetails } from './failSet';
import { FailChips } from './FailChips';
import { LinkRow } from './LinkRow';
import { ReachBreakdown, type Names } from './ReachBreakdown';
import { ReachSummary } from './ReachSummary';
import { OpenIncident } from '../operations/OpenIncident';
import { OfflineNote } from '@/src/offline/OfflineNote';
import { useOfflineNames } from '@/src/offline/names';

export function ReachScreen({ failParam }: { failParam: string | string[] | undefined }) {
  const router = useRouter();
  const parsed = useMemo(() => parseFailSet(failParam), [failParam]);
  const elements = parsed.elements;
  const failText = formatFailSet(elements);

  const setElements = useCallback(
    (next: readonly Element[]) => {
      const text = formatFailSet(next);
      router.replace((text ? `/reach?fail=${text}` : '/reach'));
    },
    [router],
  );

  // Counts and the first rows of each list; the long lists are paged on "Show all" (ReachBreakdown).
  const reach = useBriefReach(elements, failText);
  const serviceNames = useServiceNames();
  const offlineNames = useOfflineNames();
  // Site names and households come with the answer (?with=sites): the whole network is never loaded here.
  // Worked out offline, the answer has none, and the stored copy names the sites.
  const names = useMemo<Names>(() => {
    const info = reach.data?.siteInfo ?? {};
    return {
      site: (c) => info[c]?.name ?? offlineNames.site(c),
      households: (c) => info[c]?.households ?? offlineNames.households(c),
      service: (c) => serviceNames.data?.get(c) ?? offlineNames.service(c),
    };
  }, [reach.data, serviceNames.data, offlineNames]);

  const unknown = reach.error && isApiError(reach.error) && reach.error.status === 404 ? unknownFromDetails(reach.error.details) : [];

  let results: React.ReactNode;
  if (elements.length === 0) {
    results = (
      <EmptyState
        title="The failure set is empty"
        message="Search above for the site, feed or shared-risk group that has failed and add it. What goes off air shows here at once; add more to combine failures."
        testID="reach-empty"
      />
    );
  } else if (unknown.length > 0) {
    const list = unknown.map((e) => `${e.kind} ${e.code}`).join(', ');
    results = (
      <WarningBox
        title="Some of these are not in the network"
        testID="reach-unknown"
        action={<Button label="Remove them and show the rest" variant="secondary" onPress={() => setElements(elements.filter((e) => !unknown.some((u) => u.kind === e.kind && u.code === e.code)))} />}
      >
        {`Not found: ${list}. They may have been renamed or removed, or the link was mistyped. Nothing is shown until the set names only existing elements.`}
      </WarningBox>
    );
  } else if (reach.error && !reach.data) {
    results = <ErrorState what="the fault reach" error={reach.error} onRetry={() => void reach.mutate()} testID="reach-error" />;
  } else if (!reach.data) {
    results = <LoadingState what="the fault reach" testID="reach-loading" />;
  } else {
    const r = reach.data;
    results = (
      <>
        <Section
          title="What this takes off air"
          note={`Network version ${r.networkVersion}. Carriages that had no programme before the failure are not counted.`}
          aside={
            reach.isLoading ? (
              <View style={styles.updating} accessibilityLiveRegion="polite">
                <ActivityIndicator color={colors.accent} size="small" accessibilityLabel="Updating the answer" />
                <Text style={styles.updatingText}>Updating…</Text>
              </View>
            ) : undefined
          }
          testID="reach-answer"
        >
          {r.offlineCopy ? <OfflineNote networkVersion={r.networkVersion} fetchedAt={r.offlineCopy.fetchedAt} /> : null}
          <ReachSummary reach={r} />
          {r.lost.length === 0 && r.fallback.length === 0 ? (
            <Text style={styles.plain} testID="reach-nothing-lost">
              Nothing goes off air and nothing runs on a reserve: every carriage still has its main feeds.
            </Text>
          ) : null}
          {reach.error ? <Text style={styles.stale}>Showing the last answer received; refreshing it failed.</Text> : null}
          <View style={styles.diagramLink}>
            <LinkRow href={`/network?fail=${failText}`} title="See it on the network diagram" detail="Sites off air and on reserve are marked" />
          </View>
          <OpenIncident elements={elements} />
        </Section>
        <ReachBreakdown reach={r} failed={elements} failText={failText} names={names} />
      </>
    );
  }

  return (
    <Screen title="Fault reach" subtitle="Mark what has failed; see what goes off air and what stays on air on a reserve feed." actions={elements.length > 0 ? <CopyLinkButton elements={elements} /> : undefined} testID="reach-screen">
      <Section title="What has failed" testID="reach-failed">
        <ElementSearch chosen={elements} onAdd={(e) => setElements(addToFailSet(elements, e))} />
        <FailChips elements={elements} onRemove={(e) => setElements(removeFromFailSet(elements, e))} onClear={() => setElements([])} />
        {parsed.bad.length > 0 ? (
          <WarningBox
            title="Part of the link was not understood"
            testID="reach-bad-tokens"
            action={<Button label="Drop them from the link" variant="secondary" onPress={() => setElements(elements)} />}
          >
            {parsed.bad.map((b) => `"${b.token}": ${b.reason}`).join('\n')}
          </WarningBox>
        ) : null}
      </Section>
      {results}
    </Screen>
  );
}

const styles = StyleSheet.create({
  updating: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  updatingText: { ...type.small },
  plain: { ...type.body },
  stale: { ...type.small },
  diagramLink: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, overflow: 'hidden' },
});
