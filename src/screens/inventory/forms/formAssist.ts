/**
 * What the form works out for the person, so codes and frequencies are
 * rarely typed: a code proposed from the site and service (a carriage:
 * "SITE.SERVICE") or from the receiving carriage and the role (a feed:
 * "CARRIAGE.M" for a main feed, ".R" for a reserve), the frequency of a
 * channel, and a channel or frequency outside the service kind's bands
 * refused with the allowed range (shared/rf/channelRules.ts, the same
 * words the server uses).
 */
import { checkChannel, frequencyProblem } from '@/shared/rf/channelRules';
import { usualCarriageCode, type EntityKind, type ServiceKind } from '@/shared/schemas/network';
import type { Draft, FieldErrors } from './formValues';
import { parseNumber } from './formValues';

const text = (v: unknown) => (typeof v === 'string' ? v.trim() : '');

/** The code the form proposes for a new record, or null when the fields it is made from are not filled. */
export function proposedCode(kind: EntityKind, draft: Draft): string | null {
  if (kind === 'carriages') {
    const site = text(draft.site);
    const service = text(draft.service);
    return site && service ? usualCarriageCode(site, service) : null;
  }
  if (kind === 'feeds') {
    const to = text(draft.to);
    if (!to) return null;
    return `${to}.${draft.role === 'reserve' ? 'R' : 'M'}`;
  }
  return null;
}

/** The centre frequency (MHz, as form text) of the channel typed, for a service of this kind; null when none. */
export function frequencyForChannel(serviceKind: ServiceKind | undefined, channel: unknown): string | null {
  if (!serviceKind) return null;
  const c = checkChannel(serviceKind, text(channel));
  return c.ok && c.channel ? String(c.channel.centreMHz) : null;
}

/** Errors for a carriage's channel and frequency outside the bands of its service's kind. */
export function bandErrors(kind: EntityKind, draft: Draft, serviceKind: ServiceKind | undefined): FieldErrors {
  const out: FieldErrors = {};
  if (kind !== 'carriages' || !serviceKind) return out;
  const c = checkChannel(serviceKind, text(draft.channel));
  if (!c.ok) out.channel = c.message;
  const f = parseNumber(text(draft.frequencyMHz));
  const problem = f === undefined || Number.isNaN(f) ? null : frequencyProblem(serviceKind, f);
  if (problem) out.frequencyMHz = problem;
  return out;
}
