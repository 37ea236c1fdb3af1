/**
 * The words a person reads for the stored codes of the network format: a
 * site type, a feed's main or reserve, a service kind, a medium. One place,
 * so every screen, list, CSV and server sentence says the same thing
 * (docs/screens.md, "One word for each thing").
 */
import type { FeedRole, ServiceKind, SiteRole } from './schemas/network';

/** Site type, lower case for running text: "main station", never a bare "main". */
export const SITE_TYPE_WORDS: Readonly<Record<SiteRole, string>> = { origin: 'origin', main: 'main station', relay: 'relay' };

/** A feed's role in words: "main feed", "reserve feed". */
export const FEED_ROLE_WORDS: Readonly<Record<FeedRole, string>> = { main: 'main feed', reserve: 'reserve feed' };

/** A service kind by its name, not the stored code ("dtt"). */
export const SERVICE_KIND_WORDS: Readonly<Record<ServiceKind, string>> = {
  dtt: 'DVB-T multiplex',
  fm: 'FM',
  dab: 'DAB ensemble',
  am: 'AM',
  other: 'other',
};

const lookup = (table: Readonly<Record<string, string>>, code: string | null | undefined) => (code == null ? '' : (table[code] ?? code));

export const siteTypeWord = (role: string | null | undefined) => lookup(SITE_TYPE_WORDS, role);
export const feedRoleWord = (role: string | null | undefined) => lookup(FEED_ROLE_WORDS, role);
export const serviceKindWord = (kind: string | null | undefined) => lookup(SERVICE_KIND_WORDS, kind);

/** First letter upper case, for a label or a table cell: "Main station". */
export const capitalised = (text: string) => (text ? text[0].toUpperCase() + text.slice(1) : text);
