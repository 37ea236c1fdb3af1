/**
 * Imports a network document (docs/format.md, "Import
 * rules"): everything is validated first and every problem reported; then,
 * in one transaction, entities are upserted by code (unchanged ones are not
 * touched, so their versions stay), with `replace` whatever the document
 * leaves out is deleted, and the network version moves once if anything
 * changed. A dry run answers the same report and writes nothing. One audit
 * row records each import that was carried out.
 */
import crypto from 'node:crypto';
import { ENTITY_KINDS, type EntityKind, type NetworkDocument } from '@/shared/schemas/network';
import type { ImportIssue, ImportProgress, ImportReport } from '@/shared/schemas/import';
import type { Database } from '../db';
import { validateDocumentInTurns } from '../interchange/validate';
import { capIssues, type RowsOf } from '../interchange/issues';
import { Turns, nextTurn } from '../interchange/turns';
import { loadNetworkDocument } from './networkLoader';
import type { Actor } from './audit';
import { countsOf, emptyCounts, planImport, type ImportPlan } from './import/plan';
import { checkKeptFeeds } from './import/storedConflicts';
import { RollBack, withNetworkWrite, type NetworkWrite } from './inventory/networkWrite';
import { analyze, deleteByCodes, writeEntities } from './inventory/tables';
import { databaseRefusal } from './inventory/dbErrors';
import { copyCreated } from './import/copy';
import { staleBase, staleRefusal } from './import/staleBase';
import { deletionsOf, replaceToken, requireConfirmation } from './import/confirmReplace';

export interface ImportOptions {
  dryRun?: boolean;
  /** make the network equal to the document: delete what it leaves out */
  replace?: boolean;
  actor?: Actor;
  /** for a document read from CSV (server/interchange/csv.ts readCsvFiles): each entity's file and row */
  rowsOf?: RowsOf;
  /** problems found reading the upload itself (file names, headers, CSV syntax), reported first */
  sourceErrors?: ImportIssue[];
  /** more of them, counted only */
  moreSourceErrors?: number;
  /** carry out a replace made from an older network version, undoing the changes since (import/staleBase.ts) */
  undoNewer?: boolean;
  /** a replace's confirmation: the `confirmReplace` its dry run answered (import/confirmReplace.ts) */
  confirmReplace?: string;
  /** hears each step of the import: validating and writing, with entities done of total */
  onProgress?: (progress: ImportProgress) => void;
  /**
   * Aborted when the client is gone (the route ties it to the request): the
   * import stops at its next turn and the transaction rolls back, so the
   * database stays as it was. Throws the signal's reason.
   */
  signal?: AbortSignal;
}

/** Rows written between two progress reports (and checks that the client is still there). */
const WRITE_SLICE = 8000;

/** Below this many written rows the planner's old statistics do no harm (tables.ts, analyze). */
const ANALYZE_AFTER_ROWS = 2000;

/** Issues found beyond what the validator keeps: only counted (server/interchange/issues.ts). */
interface Unlisted {
  moreErrors?: number;
  moreWarnings?: number;
}
type Checked = ({ document: NetworkDocument; warnings: ImportIssue[] } | { document: null; errors: ImportIssue[]; warnings: ImportIssue[] }) & Unlisted;

/** Validates against the stored network: an upsert may refer to stored entities, a replace may not. */
async function check(raw: unknown, stored: NetworkDocument, opts: ImportOptions, replace: boolean): Promise<Checked> {
  // an upload that could not be read at all has nothing more to validate
  if (raw === undefined && opts.sourceErrors?.length) return { document: null, errors: opts.sourceErrors, warnings: [], moreErrors: opts.moreSourceErrors };
  const result = await validateDocumentInTurns(raw, {
    rowsOf: opts.rowsOf,
    context: replace ? undefined : await storedOutside(stored, raw),
    signal: opts.signal,
    onStep: (done, total) => opts.onProgress?.({ stage: 'validating', done, total }),
  });
  const errors = [...(opts.sourceErrors ?? []), ...result.errors];
  if (errors.length === 0 && result.document && !replace) errors.push(...checkKeptFeeds(stored, result.document, opts.rowsOf));
  const unlisted = { moreErrors: (result.moreErrors ?? 0) + (opts.moreSourceErrors ?? 0), moreWarnings: result.moreWarnings };
  if (errors.length > 0 || !result.document) return { document: null, errors, warnings: result.warnings, ...unlisted };
  return { document: result.document, warnings: result.warnings, ...unlisted };
}

/**
 * The stored entities the document does not carry. The validator overlays the
 * document on its context by code, so leaving out what the document replaces
 * gives the same view, and re-importing a whole network costs no more than
 * importing it into an empty one. Gives the event loop a turn when one is due:
 * both sides may hold a national network.
 */
async function storedOutside(stored: NetworkDocument, raw: unknown): Promise<NetworkDocument> {
  const turns = new Turns();
  const top = raw !== null && typeof raw === 'object' ? (raw as Record<string, unknown>) : {};
  const out = { ...stored };
  for (const kind of ENTITY_KINDS) {
    const list = top[kind];
    if (!Array.isArray(list) || list.length === 0 || stored[kind].length === 0) continue;
    const inDocument = new Set<unknown>();
    for (const item of list) {
      if (item !== null && typeof item === 'object') inDocument.add((item as { code?: unknown }).code);
      if (turns.due()) await nextTurn();
    }
    const kept: unknown[] = [];
    for (const e of stored[kind] as Array<{ code: string }>) {
      if (!inDocument.has(e.code)) kept.push(e);
      if (turns.due()) await nextTurn();
    }
    (out as Record<EntityKind, unknown[]>)[kind] = kept;
  }
  return out;
}

function receivedCounts(raw: unknown): Record<EntityKind, number> {
  const out = {} as Record<EntityKind, number>;
  for (const kind of ENTITY_KINDS) {
    const list = raw !== null && typeof raw === 'object' ? (raw as Record<string, unknown>)[kind] : undefined;
    out[kind] = Array.isArray(list) ? list.length : 0;
  }
  return out;
}

/** The report as answered: at most MAX_REPORTED_ISSUES errors and warnings each, with the count of the rest. */
function capped(report: ImportReport, unlisted: Unlisted = {}): ImportReport {
  const errors = capIssues(report.errors, unlisted.moreErrors ?? 0);
  const warnings = capIssues(report.warnings, unlisted.moreWarnings ?? 0);
  return {
    ...report,
    errors: errors.shown,
    warnings: warnings.shown,
    ...(errors.more > 0 ? { moreErrors: errors.more } : {}),
    ...(warnings.more > 0 ? { moreWarnings: warnings.more } : {}),
  };
}

export async function importNetwork(db: Database, raw: unknown, opts: ImportOptions = {}): Promise<ImportReport> {
  const dryRun = opts.dryRun === true;
  const replace = opts.replace === true;
  const received = receivedCounts(raw);
  const failed = (errors: ImportIssue[], warnings: ImportIssue[], networkVersion?: number, unlisted?: Unlisted): ImportReport =>
    capped({ ok: false, dryRun, replace, counts: emptyCounts(received), errors, warnings, ...(networkVersion !== undefined ? { networkVersion } : {}) }, unlisted);

  if (dryRun) {
    const { document: stored, version } = await loadNetworkDocument(db.sequelize);
    const checked = await check(raw, stored, opts, replace);
    if (!checked.document) return failed(checked.errors, checked.warnings, version, checked);
    const plan = await planImport(stored, checked.document, replace);
    const stale = replace ? await staleBase(db.sequelize, raw, version) : undefined;
    const confirm = replace ? { confirmReplace: replaceToken(version, deletionsOf(plan)) } : {};
    return capped({ ok: true, dryRun, replace, counts: countsOf(plan, received), errors: [], warnings: checked.warnings, networkVersion: version, ...(stale ? { stale } : {}), ...confirm }, checked);
  }

  try {
    const outcome = await withNetworkWrite(db.sequelize, opts.actor ?? {}, async (w) => {
      const { document: stored } = await loadNetworkDocument(db.sequelize, w.transaction);
      opts.signal?.throwIfAborted();
      const checked = await check(raw, stored, opts, replace);
      if (!checked.document) throw new RollBack(failed(checked.errors, checked.warnings, undefined, checked));
      const stale = replace ? await staleBase(db.sequelize, raw, w.startVersion, w.transaction) : undefined;
      if (stale && !opts.undoNewer) throw staleRefusal(stale);
      const plan = await planImport(stored, checked.document, replace);
      if (replace) requireConfirmation(opts.confirmReplace, w.startVersion, plan);
      await carryOut(w, plan, opts);
      opts.signal?.throwIfAborted();
      const counts = countsOf(plan, received);
      if (plan.changed) w.markChanged();
      w.audit({ action: 'import', entityKind: 'network', after: { replace, counts, warnings: checked.warnings.length, ...(stale ? { undid: stale } : {}) } });
      return capped({ ok: true, dryRun, replace, counts, errors: [], warnings: checked.warnings }, checked);
    });
    return { ...outcome.result, networkVersion: outcome.networkVersion };
  } catch (err) {
    const refusal = databaseRefusal(err);
    if (!refusal) throw err;
    return failed([{ kind: 'document', rule: 'database-refused', message: `nothing was imported: ${refusal.message}` }], []);
  }
}

/**
 * The order keeps every foreign key and the one-carriage-per-(site, service)
 * rule satisfied at each statement: dropped feeds go first, then the things
 * carriages refer to, then carriages (after any that hold a wanted place have
 * stepped aside), then feeds and their via-sites and groups, and last what
 * `replace` drops, referrers before the referred.
 */
async function carryOut(w: NetworkWrite, plan: ImportPlan, opts: Pick<ImportOptions, 'onProgress' | 'signal'>): Promise<void> {
  const k = plan.kinds;
  const total = ENTITY_KINDS.reduce((n, kind) => n + k[kind].create.length + k[kind].update.length + k[kind].remove.length, 0);
  let done = 0;
  const step = (n: number) => {
    done += n;
    opts.onProgress?.({ stage: 'writing', done, total });
    opts.signal?.throwIfAborted();
  };
  step(0);
  // In slices, so progress moves and a client that is gone stops the write within a slice.
  // New entities through COPY (import/copy.ts); changed ones through the multi-row upsert, which COPY cannot do.
  const write = async (kind: EntityKind) => {
    await copyCreated(w, kind, k[kind].create, { signal: opts.signal, step });
    const list = k[kind].update;
    for (let i = 0; i < list.length; i += WRITE_SLICE) {
      const slice = list.slice(i, i + WRITE_SLICE);
      await writeEntities(w, kind, slice);
      step(slice.length);
    }
  };
  const remove = async (kind: EntityKind, codes: readonly string[]) => {
    await deleteByCodes(w, kind, codes);
    step(codes.length);
  };
  const many = (...kinds: EntityKind[]) => kinds.reduce((n, kind) => n + k[kind].create.length + k[kind].update.length, 0) >= ANALYZE_AFTER_ROWS;
  await remove('feeds', k.feeds.remove);
  await write('services');
  await write('groups');
  await write('sites');
  if (many('services', 'groups', 'sites')) await analyze(w, ['sites', 'services', 'risk_groups', 'site_groups']);
  const parking = await parkCarriages(w, plan.park);
  await write('carriages');
  if (many('carriages')) await analyze(w, ['carriages']);
  await write('feeds');
  if (many('feeds')) await analyze(w, ['feeds', 'feed_via_sites', 'feed_groups']);
  await remove('carriages', k.carriages.remove);
  if (parking.length > 0) await deleteByCodes(w, 'services', parking);
  await remove('sites', k.sites.remove);
  await remove('groups', k.groups.remove);
  await remove('services', k.services.remove);
}

/**
 * Moves each carriage in `codes` onto a service of its own, made for the
 * length of this transaction, so its (site, service) place is free. Each of
 * them is then either written to its new place or deleted, and the parking
 * services are deleted again before commit; nothing of them is ever visible.
 */
async function parkCarriages(w: NetworkWrite, codes: readonly string[]): Promise<string[]> {
  if (codes.length === 0) return [];
  const prefix = `.parking-${crypto.randomBytes(6).toString('hex')}-`;
  const parking = codes.map((_, i) => `${prefix}${i}`);
  await w.sequelize.query(`INSERT INTO services (code, name, kind) SELECT code, 'parking', 'other' FROM unnest($1::text[]) AS u(code)`, {
    bind: [parking],
    transaction: w.transaction,
  });
  await w.sequelize.query(
    `UPDATE carriages c SET service_id = s.id FROM unnest($1::text[], $2::text[]) AS u(carriage, parking)
     JOIN services s ON s.code = u.parking WHERE c.code = u.carriage`,
    { bind: [codes, parking], transaction: w.transaction },
  );
  return parking;
}
