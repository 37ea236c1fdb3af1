/**
 * PostgreSQL keeps its own copy of the rules (constraints in the schema
 * migration), so a value the API's checks let through can still be refused
 * there. Such a refusal is about the input, never a server fault: these
 * helpers turn it into a sentence for a 4xx answer or an import error.
 * SQLSTATE classes 22 (data exception) and 23 (integrity constraint
 * violation): PostgreSQL documentation, Appendix A "PostgreSQL Error Codes".
 */
interface PgError {
  code: string;
  message: string;
  constraint?: string;
  table?: string;
  column?: string;
}

export interface DatabaseRefusal {
  sqlState: string;
  constraint?: string;
  message: string;
}

const READABLE: Record<string, string> = {
  carriages_site_service_key: 'a site radiates each service once: another carriage already carries this service at this site',
  feeds_not_to_itself: 'a feed joins two different carriages',
};

/** The refusal, when the error is PostgreSQL refusing the data; undefined for anything else. */
export function databaseRefusal(err: unknown): DatabaseRefusal | undefined {
  const e = err as { parent?: PgError; original?: PgError } & Partial<PgError>;
  const pg = e?.parent ?? e?.original ?? (typeof e?.code === 'string' ? (e as PgError) : undefined);
  if (!pg || typeof pg.code !== 'string' || !/^2[23]/.test(pg.code)) return undefined;
  const readable = pg.constraint ? READABLE[pg.constraint] : undefined;
  const where = pg.constraint ? ` (rule ${pg.constraint})` : pg.column ? ` (column ${pg.column})` : '';
  return { sqlState: pg.code, constraint: pg.constraint, message: readable ?? `the database refused the data: ${pg.message}${where}` };
}
