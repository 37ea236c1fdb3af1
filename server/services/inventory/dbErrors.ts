/**
 * PostgreSQL keeps its own copy of the rules (constraints in the schema
 * migration), so a value the API's checks let through can still be refused
 * there. Such a refusal is about the input, never a server fault. This is
 * the one place that turns it into words of the API: the field by its API
 * name (`groundHeightM`, `site`), never a table, column or constraint name,
 * and never PostgreSQL's own message, which quotes SQL and values.
 * SQLSTATE classes 22 (data exception) and 23 (integrity constraint
 * violation): PostgreSQL documentation, Appendix A "PostgreSQL Error Codes".
 */
import { ApiError } from '../../http/errors';

interface PgError {
  code: string;
  message: string;
  constraint?: string;
  table?: string;
  column?: string;
}

export interface DatabaseRefusal {
  sqlState: string;
  /** the API field the refusal is about, when it can be told */
  field?: string;
  /** 409 for a clash with another record, 422 for a value that is not allowed */
  status: 409 | 422;
  message: string;
}

const NOUNS: Record<string, string> = {
  sites: 'site', services: 'service', risk_groups: 'group', carriages: 'carriage', feeds: 'feed',
  feed_via_sites: 'feed', feed_groups: 'feed', site_groups: 'site', users: 'person', audit_log: 'change', network_state: 'network',
};

/** Columns whose API name is not the camel-case form of the column name. */
const FIELDS: Record<string, string> = {
  site_id: 'site', service_id: 'service', from_carriage_id: 'from', to_carriage_id: 'to', group_id: 'groups',
  frequency_mhz: 'frequencyMHz', rx_frequency_mhz: 'rxFrequencyMHz', feed_id: 'feed', user_id: 'user',
};
const VIA_FIELDS: Record<string, string> = { site_id: 'via', position: 'via' };

const camel = (column: string) => column.replace(/_([a-z])/g, (_m, c: string) => c.toUpperCase());

function fieldOf(table: string | undefined, column: string | undefined): string | undefined {
  if (!column) return undefined;
  if (table === 'feed_via_sites' && VIA_FIELDS[column]) return VIA_FIELDS[column];
  return FIELDS[column] ?? camel(column);
}

/** Splits a default constraint name "<table>_<columns>_<key|fkey|check>" into its table and column. */
function fromConstraint(name: string | undefined, table: string | undefined): { column?: string; kind?: string } {
  if (!name) return {};
  const m = /^(.*)_(key|fkey|check)$/.exec(name);
  if (!m) return {};
  const rest = table && m[1].startsWith(`${table}_`) ? m[1].slice(table.length + 1) : m[1];
  return { column: rest, kind: m[2] };
}

/** Rules with a name of their own, said in the API's words. */
const NAMED: Record<string, { field: string; message: string; status: 409 | 422 }> = {
  carriages_site_service_key: { field: 'service', status: 409, message: 'a site radiates each service once: another carriage already carries this service at this site' },
  feeds_not_to_itself: { field: 'to', status: 422, message: 'a feed joins two different carriages' },
  users_email_key: { field: 'email', status: 409, message: 'someone already has this e-mail address' },
};

function pgErrorOf(err: unknown): PgError | undefined {
  const e = err as { parent?: PgError; original?: PgError } & Partial<PgError>;
  const pg = e?.parent ?? e?.original ?? (typeof e?.code === 'string' ? (e as PgError) : undefined);
  return pg && typeof pg.code === 'string' && /^2[23]/.test(pg.code) ? pg : undefined;
}

/** The refusal, when the error is PostgreSQL refusing the data; undefined for anything else. */
export function databaseRefusal(err: unknown): DatabaseRefusal | undefined {
  const pg = pgErrorOf(err);
  if (!pg) return undefined;
  const named = pg.constraint ? NAMED[pg.constraint] : undefined;
  if (named) return { sqlState: pg.code, ...named };
  const parsed = fromConstraint(pg.constraint, pg.table);
  const field = fieldOf(pg.table, pg.column ?? parsed.column);
  const noun = (pg.table && NOUNS[pg.table]) ?? 'record';
  const the = field ? `${field}` : 'a value';
  switch (pg.code) {
    case '23505':
      return { sqlState: pg.code, field, status: 409, message: `${the} is already used by another ${noun}; it must be unique` };
    case '23503':
      return { sqlState: pg.code, field, status: 409, message: `${the} refers to a record that does not exist, or the ${noun} is still referred to by others` };
    case '23502':
      return { sqlState: pg.code, field, status: 422, message: `${the} is required` };
    case '23514':
      return { sqlState: pg.code, field, status: 422, message: `${the} is outside what a ${noun} allows` };
    case '22001':
      return { sqlState: pg.code, field, status: 422, message: `${the} is longer than allowed` };
    case '22003':
      return { sqlState: pg.code, field, status: 422, message: `${the} is a number out of range` };
    case '22021':
    case '22P05':
      return { sqlState: pg.code, field, status: 422, message: `${the} holds a character that cannot be stored` };
    default:
      return { sqlState: pg.code, field, status: 422, message: `${the} was refused as not valid` };
  }
}

/** The refusal as the API's error: 409 or 422, with the field named in the details. */
export function refusalError(refusal: DatabaseRefusal): ApiError {
  const details = refusal.field ? [{ field: refusal.field, message: refusal.message }] : undefined;
  return new ApiError(refusal.status, refusal.status === 409 ? 'conflict' : 'invalid', refusal.message, details);
}
