/**
 * Every feed's failed checks, worst first (docs/checks.md, `GET /api/checks`).
 * Pure: takes the network's records, no database.
 */
import type { Carriage, Feed, Service, Site } from '@/shared/schemas/network';
import type { CheckFailure, CheckName, ChecksListAnswer, CheckSeverity, FeedCheck } from '@/shared/schemas/checks';
import { computeFeedChecks, type FeedCheckInput } from './feedChecks';
import { stepsInTurns, Turns } from '../interchange/turns';

export interface NetworkRecords {
  sites: readonly Site[];
  services: readonly Service[];
  carriages: readonly Carriage[];
  feeds: readonly Feed[];
}

/** A feed whose references do not resolve (unknown carriage, site or service code). */
export class CheckInputError extends Error {
  constructor(
    message: string,
    readonly code: string,
  ) {
    super(message);
    this.name = 'CheckInputError';
  }
}

/**
 * Severity of a failed check: an error means the feed cannot work as recorded; a warning
 * means the record disagrees with the geometry. Info checks (loss, bulge, F1) never fail.
 */
export const SEVERITY_OF: Readonly<Record<CheckName, CheckSeverity>> = {
  'channel-clash': 'error',
  'field-strength': 'error',
  clearance: 'error',
  horizon: 'error',
  'bearing-record': 'warning',
  'free-space-loss': 'warning',
  'earth-bulge': 'warning',
  'fresnel-f1': 'warning',
};

/** Order among errors: the checks that most surely stop a feed come first. */
const CHECK_RANK: readonly CheckName[] = ['channel-clash', 'field-strength', 'clearance', 'horizon', 'bearing-record', 'free-space-loss', 'earth-bulge', 'fresnel-f1'];
const SEVERITY_RANK: Record<CheckSeverity, number> = { error: 0, warning: 1 };

/** Signed distance from the limit in the check's unit; negative when failing (see CheckFailure.margin). */
export function marginOf(c: FeedCheck): number | undefined {
  if (c.value === null) return undefined;
  const limit = c.limit ?? null;
  switch (c.name) {
    case 'field-strength':
      return limit === null ? undefined : c.value - limit;
    case 'horizon':
      return limit === null ? undefined : limit - c.value;
    case 'clearance':
      return c.value;
    case 'bearing-record':
      return limit === null ? undefined : limit - c.value;
    default:
      return undefined;
  }
}

export function compareFailures(a: CheckFailure, b: CheckFailure): number {
  return (
    SEVERITY_RANK[a.severity] - SEVERITY_RANK[b.severity] ||
    CHECK_RANK.indexOf(a.check.name) - CHECK_RANK.indexOf(b.check.name) ||
    (a.margin ?? Number.NEGATIVE_INFINITY) - (b.margin ?? Number.NEGATIVE_INFINITY) ||
    (a.feed < b.feed ? -1 : a.feed > b.feed ? 1 : 0)
  );
}

function byCode<T extends { code: string }>(items: readonly T[]): Map<string, T> {
  return new Map(items.map((x) => [x.code, x]));
}

export interface NetworkIndex {
  sites: Map<string, Site>;
  services: Map<string, Service>;
  carriages: Map<string, Carriage>;
  feeds: Map<string, Feed>;
}

export function indexNetwork(net: NetworkRecords): NetworkIndex {
  return { sites: byCode(net.sites), services: byCode(net.services), carriages: byCode(net.carriages), feeds: byCode(net.feeds) };
}

/** Resolves a feed's carriages, sites and service kind; throws CheckInputError naming an unknown code. */
export function feedCheckInput(index: NetworkIndex, feed: Feed): FeedCheckInput {
  const source = index.carriages.get(feed.from);
  if (!source) throw new CheckInputError(`feed ${feed.code}: source carriage ${feed.from} does not exist`, feed.from);
  const target = index.carriages.get(feed.to);
  if (!target) throw new CheckInputError(`feed ${feed.code}: receiving carriage ${feed.to} does not exist`, feed.to);
  const sourceSite = index.sites.get(source.site);
  if (!sourceSite) throw new CheckInputError(`carriage ${source.code}: site ${source.site} does not exist`, source.site);
  const targetSite = index.sites.get(target.site);
  if (!targetSite) throw new CheckInputError(`carriage ${target.code}: site ${target.site} does not exist`, target.site);
  const service = index.services.get(target.service);
  if (!service) throw new CheckInputError(`carriage ${target.code}: service ${target.service} does not exist`, target.service);
  return { feed, source, target, sourceSite, targetSite, serviceKind: service.kind };
}

/** Checks of one feed by code; throws CheckInputError when the feed code is unknown. */
export function checksForFeed(index: NetworkIndex, feedCode: string) {
  const feed = index.feeds.get(feedCode);
  if (!feed) throw new CheckInputError(`feed ${feedCode} does not exist`, feedCode);
  return computeFeedChecks(feedCheckInput(index, feed));
}

/**
 * Failed checks (ok === false) of every feed at or above `severity`: 'warning' (default)
 * lists warnings and errors, 'error' only errors. Checks not computed are not failures.
 */
export function networkCheckFailures(net: NetworkRecords, options: FailureOptions = {}): ChecksListAnswer {
  const pass = failurePass(net, options);
  for (;;) {
    const step = pass.next();
    if (step.done) return step.value;
  }
}

/**
 * The same list, giving the event loop a turn whenever one is due
 * (server/interchange/turns.ts): screening every feed of a national network
 * takes seconds, which other requests must not wait for.
 */
export function networkCheckFailuresInTurns(net: NetworkRecords, options: FailureOptions = {}, turns = new Turns()): Promise<ChecksListAnswer> {
  return stepsInTurns(failurePass(net, options), turns);
}

interface FailureOptions {
  severity?: CheckSeverity;
  networkVersion?: number;
  /** the look-ups by code when the caller holds them already (a server's served network): building them is a second of work at 100,000 sites */
  index?: NetworkIndex;
}

/** The list's one pass, pausable after each feed. */
function* failurePass(net: NetworkRecords, options: FailureOptions): Generator<void, ChecksListAnswer> {
  const floor = SEVERITY_RANK[options.severity ?? 'warning'];
  const index = options.index ?? indexNetwork(net);
  yield;
  const failures: CheckFailure[] = [];
  for (const feed of net.feeds) {
    yield;
    const answer = computeFeedChecks(feedCheckInput(index, feed));
    for (const check of answer.checks) {
      if (check.ok !== false) continue;
      const severity = SEVERITY_OF[check.name];
      if (SEVERITY_RANK[severity] > floor) continue;
      const f: CheckFailure = { feed: feed.code, from: feed.from, to: feed.to, medium: feed.medium, check, severity };
      const margin = marginOf(check);
      if (margin !== undefined) f.margin = Math.round(margin * 1000) / 1000;
      failures.push(f);
    }
  }
  failures.sort(compareFailures);
  const answer: ChecksListAnswer = { failures };
  if (options.networkVersion !== undefined) answer.networkVersion = options.networkVersion;
  return answer;
}
