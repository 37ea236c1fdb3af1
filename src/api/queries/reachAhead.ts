/**
 * Fault reach asked for ahead of the screen that shows it: the network
 * diagram's overlay link sends the request as it is pressed, and the
 * screen's read (useReach in ./analysis.ts) takes the answer. No React here,
 * so the unit tests can use it.
 */
import { api } from '@/shared/api';
import type { Element } from '@/shared/schemas/analysis';
import { browserOffline } from '@/src/offline/online';
import { parseFailSet } from '@/src/screens/reach/failSet';
import type { Send } from '../ApiProvider';

/** The server's reach answer for `failed`, with the names and households of the sites listed (?with=sites). */
export const askReach = (send: Send, failed: readonly Element[]) => send(`${api.reach}?with=sites`, { method: 'POST', body: { failed } });

/** How long a reach asked for ahead of its screen (`askReachAhead`) waits to be taken; our choice. */
export const AHEAD_MS = 10_000;
const ahead = new Map<string, { at: number; answer: Promise<unknown> }>();

/**
 * Sends the reach request for a failure set (its canonical text, as
 * formatFailSet writes it and the screen will read it from the address) now,
 * from the press that will show it, before the address changes and the
 * screen renders again (about 85 ms in a trace at 20,000 sites); `useReach`
 * for the same set takes the answer instead of asking again. Left untaken
 * for AHEAD_MS, it is dropped. Nothing is sent while the browser is offline:
 * the stored copy answers then (useCopyFallback).
 */
export function askReachAhead(send: Send, failSet: string, now = Date.now()): void {
  for (const [k, v] of ahead) if (now - v.at > AHEAD_MS) ahead.delete(k);
  const { elements } = parseFailSet(failSet);
  if (elements.length === 0 || ahead.has(failSet) || browserOffline()) return;
  const answer = askReach(send, elements);
  answer.catch(() => undefined); // a failure is reported where the answer is taken
  ahead.set(failSet, { at: now, answer });
}

/** The answer asked for ahead for `failSet`, once (undefined when none, or left too long). */
export function takeReachAhead(failSet: string, now = Date.now()): Promise<unknown> | undefined {
  const held = ahead.get(failSet);
  ahead.delete(failSet);
  return held && now - held.at <= AHEAD_MS ? held.answer : undefined;
}
