/**
 * Proposals: the new reserve feed that closes each diversity gap, best first
 * over the network, and a plan of several feeds tried in a sandbox before an
 * engineer creates them for real (server/engine/proposals.ts, plan.ts).
 */
import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { useSWRConfig } from 'swr';
import type { ExposureRow } from '@/shared/schemas/analysis';
import { useSend } from '@/src/api/ApiProvider';
import { useMe } from '@/src/api/queries/me';
import { applyPlan, makePlan, useNetworkProposals, useSandboxDiversity } from '@/src/api/queries/planner';
import type { PlanResult } from '@/src/api/schemas';
import { Button } from '@/src/components/Button';
import { Caution } from '@/src/components/Caution';
import { Choice } from '@/src/components/Choice';
import { formatCount } from '@/shared/format';
import { describeError, ErrorState, LoadingState } from '@/src/components/states';
import { StatusShape } from '@/src/components/StatusShape';
import { Capped } from '@/src/screens/reach/Capped';
import { LinkRow } from '@/src/screens/reach/LinkRow';
import { colors, radius, space, type } from '@/src/theme';
import { elementWords } from './elementNames';
import { proposalDetail, proposalTitle } from './plannerWords';
import { WorkProgress } from './WorkProgress';

export const PROPOSALS_SHOWN = 20;
const RULE_OF_THUMB =
  'Rule of thumb (common practice, not a costing): an off-air reserve from a nearby site needs only a receiver on the mast, so it is listed before a satellite or line feed from an origin that protects as much.';

export function ProposalsList() {
  const proposals = useNetworkProposals(PROPOSALS_SHOWN);
  if (proposals.error && !proposals.data) return <ErrorState what="the proposals" error={proposals.error} onRetry={() => void proposals.mutate()} />;
  if (!proposals.data) return <LoadingState what="the proposals" />;
  if (proposals.data.state === 'running') {
    return <WorkProgress what="Ranking the new feeds over the network" label="Proposals ranked so far" progress={proposals.data.progress} testID="proposals-running" />;
  }
  const list = proposals.data.proposals;
  return (
    <View style={styles.wrap} testID="proposals">
      {list.length === 0 ? (
        <Text style={styles.body}>No new feed would close a gap: every weak point left holds every origin of its service.</Text>
      ) : (
        <Capped
          items={list}
          what="proposals"
          first={5}
          render={(p) => <LinkRow key={`${p.carriage}:${p.from}:${p.medium}`} href={`/carriages/${encodeURIComponent(p.carriage)}`} title={proposalTitle(p)} detail={proposalDetail(p)} />}
        />
      )}
      <Text style={styles.note}>{RULE_OF_THUMB}</Text>
      <Caution>Off-air sources are screened over free space and a smooth earth (k = 4/3). Work on a mast means RF exposure and work at height: follow the site rules.</Caution>
    </View>
  );
}

function Ranking({ title, rows }: { title: string; rows: ExposureRow[] }) {
  return (
    <View style={styles.column}>
      <Text style={styles.heading}>{title}</Text>
      {rows.slice(0, 5).map((r, i) => (
        <Text key={`${r.element.kind}:${r.element.code}`} style={styles.body}>{`${i + 1}. ${elementWords(r.element)}: ${formatCount(r.households)} households`}</Text>
      ))}
    </View>
  );
}

export function PlanPanel() {
  const send = useSend();
  const me = useMe();
  const { mutate } = useSWRConfig();
  const [budget, setBudget] = useState<'1' | '3' | '5'>('3');
  const [plan, setPlan] = useState<PlanResult | null>(null);
  const [busy, setBusy] = useState(false);
  const [said, setSaid] = useState<string | null>(null);
  const sandbox = useSandboxDiversity(plan?.id ?? null);
  const mayCreate = me.data?.user.role === 'engineer' || me.data?.user.role === 'admin';

  const tryIt = async () => {
    setBusy(true);
    setSaid(null);
    try {
      setPlan(await makePlan(send, Number(budget)));
    } catch (e) {
      setSaid(`Could not make the plan: ${describeError(e)}`);
    } finally {
      setBusy(false);
    }
  };
  const createForReal = async () => {
    if (!plan) return;
    setBusy(true);
    try {
      const out = await applyPlan(send, plan.id);
      setPlan(null);
      setSaid(`Created ${formatCount(out.created.length)} feed${out.created.length === 1 ? '' : 's'}: ${out.created.join(', ')} (network version ${out.networkVersion}).`);
      await mutate(() => true);
    } catch (e) {
      setSaid(`Nothing was created: ${describeError(e)}`);
    } finally {
      setBusy(false);
    }
  };

  return (
    <View style={styles.wrap}>
      <Choice
        label="New feeds to plan"
        options={[
          { value: '1', label: '1 feed' },
          { value: '3', label: '3 feeds' },
          { value: '5', label: '5 feeds' },
        ]}
        value={budget}
        onChange={setBudget}
        testID="plan-budget"
      />
      <Button label="Try it" onPress={() => void tryIt()} busy={busy && !plan} accessibilityLabel="Try it: the plan in a sandbox" testID="plan-try" />
      {said ? <Text style={styles.body} accessibilityLiveRegion="polite">{said}</Text> : null}
      {plan ? (
        <View style={styles.sandbox} testID="sandbox-banner" accessibilityRole="alert">
          <View style={styles.bannerHead}>
            <StatusShape shape="half" color={colors.warn} size={18} />
            <Text style={styles.heading}>Sandbox: nothing here is stored</Text>
          </View>
          <Text style={styles.body}>{`These answers are for the network with ${formatCount(plan.picks.length)} planned feed${plan.picks.length === 1 ? '' : 's'} added (network version ${plan.networkVersion}). Each pick was the best on the network with the earlier picks added.`}</Text>
          {plan.picks.map((p, i) => (
            <Text key={p.feed} style={styles.body}>{`${i + 1}. ${proposalTitle(p)} (feed ${p.feed}): ${proposalDetail(p)}`}</Text>
          ))}
          <Text style={styles.body}>{`Diversity gaps: ${formatCount(plan.gaps.before)} now, ${formatCount(sandbox.data?.carriages.length ?? plan.gaps.after)} with the plan. Households protected: ${formatCount(plan.householdsProtected)}.`}</Text>
          <View style={styles.columns}>
            <Ranking title="Most exposed now" rows={plan.exposure.before} />
            <Ranking title="With the plan" rows={plan.exposure.after} />
          </View>
          <View style={styles.actions}>
            {mayCreate ? <Button label="Create for real" onPress={() => void createForReal()} busy={busy} testID="plan-create" /> : <Text style={styles.note}>An engineer can create these feeds for real.</Text>}
            <Button label="Leave the sandbox" variant="secondary" onPress={() => setPlan(null)} testID="plan-leave" />
          </View>
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  body: { ...type.body, fontSize: 16 },
  note: { ...type.small },
  heading: { ...type.body, fontSize: 17, fontWeight: '700' },
  sandbox: { gap: space.sm, padding: space.md, borderWidth: 2, borderStyle: 'dashed', borderColor: colors.warn, backgroundColor: colors.warnSoft, borderRadius: radius.md },
  bannerHead: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  columns: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  column: { flexGrow: 1, flexBasis: 160, gap: 2 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
