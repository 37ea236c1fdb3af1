/**
 * Plain words for feed checks (docs/checks.md): what each check is called
 * on screen, what state it is in, how its limit reads, and how sure the limit is.
 * Status is said in words and shape first, colour second (docs/screens.md).
 */
import { CONFIDENCE_WORDS, type CheckName, type CheckSeverity, type Confidence, type FeedCheck } from '@/shared/schemas/checks';
import { formatFigure } from '@/shared/format';

/** A check's name as a person reads it: one name on every screen and size, chips and cells included. */
export const CHECK_SHORT: Readonly<Record<CheckName, string>> = {
  'free-space-loss': 'Free-space loss',
  'field-strength': 'Field strength',
  horizon: 'Radio horizon',
  'earth-bulge': 'Earth bulge',
  'fresnel-f1': 'Fresnel zone',
  clearance: 'Clearance',
  'channel-clash': 'Channel clash',
  'bearing-record': 'Bearing record',
};

/** The same names (kept under both names so callers need not change). */
export const CHECK_TITLES = CHECK_SHORT;

/**
 * passes / fails: compared with a limit. figure: worked out, with no limit to pass or fail
 * (loss, bulge, F1 are figures for the engineer). notComputed: an input is missing.
 * notApplicable: the check does not apply to this medium.
 */
export type CheckState = 'passes' | 'fails' | 'figure' | 'notComputed' | 'notApplicable';

export type StateShape = 'solid' | 'cross' | 'ring' | 'triangle' | null;
export type StateTone = 'good' | 'bad' | 'neutral' | 'warn';

const NOT_APPLICABLE = /^not applicable:?\s*/i;
const NOT_COMPUTED = /^not computed:?\s*/i;

export function checkState(c: Pick<FeedCheck, 'ok' | 'note' | 'value' | 'limit'>): CheckState {
  if (c.ok === false) return 'fails';
  if (c.ok === true) return c.limit === undefined || c.limit === null ? 'figure' : 'passes';
  if (NOT_APPLICABLE.test(c.note)) return 'notApplicable';
  // ok = null with a value: computed, but nothing to compare it with (e.g. no planning minimum).
  if (c.value !== null && !NOT_COMPUTED.test(c.note)) return 'figure';
  return 'notComputed';
}

export interface StateWords {
  state: CheckState;
  /** The badge text: "passes", "fails", "not computed: ERP missing on carriage C12". */
  words: string;
  /** Why, when the state itself does not say it (the rest of the note). */
  reason: string | null;
  shape: StateShape;
  tone: StateTone;
}

/** The note without its "not computed:" / "not applicable:" lead-in. */
function noteBody(note: string): string {
  return note.replace(NOT_COMPUTED, '').replace(NOT_APPLICABLE, '').trim();
}

export function stateWords(c: Pick<FeedCheck, 'ok' | 'note' | 'value' | 'limit'>): StateWords {
  const state = checkState(c);
  switch (state) {
    case 'passes':
      return { state, words: 'passes', reason: null, shape: 'solid', tone: 'good' };
    case 'fails':
      return { state, words: 'fails', reason: null, shape: 'cross', tone: 'bad' };
    case 'figure':
      return { state, words: c.ok === null ? 'no limit to compare' : 'for reference', reason: null, shape: null, tone: 'neutral' };
    case 'notComputed': {
      const body = noteBody(c.note);
      return { state, words: body ? `not computed: ${body}` : 'not computed', reason: null, shape: 'ring', tone: 'neutral' };
    }
    case 'notApplicable': {
      const body = noteBody(c.note);
      return { state, words: 'does not apply', reason: body || null, shape: null, tone: 'neutral' };
    }
  }
}

/**
 * Which way a value must lie relative to its limit to pass (from the server's rules,
 * docs/checks.md): field strength, clearance and channel separation at
 * least the limit; path length and bearing error at most the limit.
 */
const LIMIT_SENSE: Partial<Record<CheckName, 'atLeast' | 'atMost'>> = {
  'field-strength': 'atLeast',
  clearance: 'atLeast',
  'channel-clash': 'atLeast',
  horizon: 'atMost',
  'bearing-record': 'atMost',
};

const LIMIT_LEAD: Partial<Record<CheckName, string>> = {
  'field-strength': 'planning minimum',
  horizon: 'radio horizon',
  clearance: 'at least',
  'channel-clash': 'at least',
  'bearing-record': 'within',
};

/** "planning minimum 56.0 dBµV/m", "radio horizon 84.43 km", or null when there is no limit. */
export function limitWords(c: Pick<FeedCheck, 'name' | 'limit' | 'unit'>): string | null {
  if (c.limit === undefined || c.limit === null) return null;
  const lead = LIMIT_LEAD[c.name] ?? (LIMIT_SENSE[c.name] === 'atMost' ? 'at most' : 'limit');
  return `${lead} ${formatFigure(c.limit, c.unit)}`;
}

/** "48.2 dBµV/m" or "not worked out" when the value is missing. */
export function valueWords(c: Pick<FeedCheck, 'value' | 'unit'>): string {
  return c.value === null ? 'no value' : formatFigure(c.value, c.unit);
}

/** Said beside a limit that is not read in its primary source (docs/checks.md marks); the note names the source. */
export function confidenceWords(confidence: Confidence | undefined): string | null {
  return confidence ? CONFIDENCE_WORDS[confidence] : null;
}

export const SEVERITY_WORDS: Readonly<Record<CheckSeverity, { words: string; shape: StateShape; tone: StateTone }>> = {
  error: { words: 'error', shape: 'cross', tone: 'bad' },
  warning: { words: 'warning', shape: 'triangle', tone: 'warn' },
};

export interface Verdict {
  /** fails: at least one check fails; clear: none fails; noneApply: no check applies to this medium. */
  kind: 'fails' | 'clear' | 'noneApply';
  /** The headline: "2 problems on this feed", "No check fails on this feed", ... */
  words: string;
  /** Checks not computed for want of a value in the record. */
  notComputed: number;
  /** When no check applies and they all say the same why, that reason once. */
  reason: string | null;
}

/** The one-line summary above a feed's checks. */
export function verdictOf(checks: readonly Pick<FeedCheck, 'ok' | 'note' | 'value' | 'limit'>[], warnings: readonly string[]): Verdict {
  const states = checks.map(stateWords);
  const notComputed = states.filter((s) => s.state === 'notComputed').length;
  const failing = states.filter((s) => s.state === 'fails').length;
  if (failing > 0 || warnings.length > 0) {
    const n = Math.max(failing, warnings.length);
    return { kind: 'fails', words: `${n === 1 ? '1 problem' : `${n} problems`} on this feed`, notComputed, reason: null };
  }
  if (states.length > 0 && states.every((s) => s.state === 'notApplicable')) {
    const reasons = new Set(states.map((s) => s.reason));
    return { kind: 'noneApply', words: 'No path check applies to this feed', notComputed: 0, reason: reasons.size === 1 ? [...reasons][0] : null };
  }
  return { kind: 'clear', words: 'No check fails on this feed', notComputed, reason: null };
}
