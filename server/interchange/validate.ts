/**
 * Validates a network document (docs/format.md) and reports
 * every error, not the first: the document's shape, each entity against its
 * schema, then the rules between entities; and the warnings that let an
 * import go ahead. The document is returned only when there is no error;
 * entities already in the schema's output form are returned as the very
 * objects given (see canonical.ts), so do not change the input afterwards.
 */
import type { ImportIssue } from '@/shared/schemas/import';
import {
  ENTITY_KINDS,
  NETWORK_FORMAT,
  networkDocumentShape,
  type EntityKind,
  type NetworkDocument,
} from '@/shared/schemas/network';
import { checkEntity } from './entities';
import { IssueSink, shown, type RowsOf } from './issues';
import { checkReferences } from './references';
import { Turns, nextTurn } from './turns';
import { buildView } from './view';
import { findWarnings } from './warnings';

export type { RowsOf } from './issues';

export interface ValidateOptions {
  /** for a document read from CSV: the file and data row of each array element, so issues name them */
  rowsOf?: RowsOf;
  /** the stored network an upsert lands on: references may point into it */
  context?: NetworkDocument;
}

export interface ValidationResult {
  document: NetworkDocument | null;
  errors: ImportIssue[];
  warnings: ImportIssue[];
  /** issues found beyond what the sink keeps (issues.ts KEEP_ISSUES), counted only */
  moreErrors?: number;
  moreWarnings?: number;
}

export function validateDocument(raw: unknown, opts: ValidateOptions = {}): ValidationResult {
  const steps = validationSteps(raw, opts);
  for (;;) {
    const next = steps.next();
    if (next.done) return next.value;
  }
}

/**
 * The same validation in turns: it gives the event loop back every couple
 * of thousand entities, so a server checking a national network keeps
 * answering other requests; `onStep` hears how many of `total` entities are
 * checked, `signal` stops it between turns (it throws the signal's reason).
 */
export async function validateDocumentInTurns(
  raw: unknown,
  opts: ValidateOptions & { onStep?: (done: number, total: number) => void; signal?: AbortSignal } = {},
): Promise<ValidationResult> {
  const steps = validationSteps(raw, opts);
  const total = entityCount(raw);
  for (;;) {
    const next = steps.next();
    if (next.done) return next.value;
    opts.onStep?.(Math.min(next.value, total), total);
    await nextTurn();
    opts.signal?.throwIfAborted();
  }
}

function entityCount(raw: unknown): number {
  if (raw === null || typeof raw !== 'object') return 0;
  let n = 0;
  for (const kind of ENTITY_KINDS) {
    const list = (raw as Record<string, unknown>)[kind];
    if (Array.isArray(list)) n += list.length;
  }
  return n;
}

/**
 * The validation as a generator that pauses (yields the entities checked so
 * far) whenever its turn has lasted long enough (turns.ts), in every pass:
 * the entity checks count once, the rules between entities pass over them
 * again (view.ts, references.ts, warnings.ts).
 */
export function* validationSteps(raw: unknown, opts: ValidateOptions = {}): Generator<number, ValidationResult> {
  const sink = new IssueSink(opts.rowsOf);
  const turns = new Turns();
  if (raw === null || typeof raw !== 'object' || Array.isArray(raw)) {
    sink.documentError('not-an-object', `the network document must be a JSON object with "format": "${NETWORK_FORMAT}" (got ${shown(Array.isArray(raw) ? 'a list' : raw)})`);
    return { document: null, ...sink.sorted() };
  }
  const top = raw as Record<string, unknown>;
  const unreadable = checkShape(top, sink);

  const lists: Partial<Record<EntityKind, unknown[]>> = {};
  const parsed = {} as { [K in EntityKind]: NetworkDocument[K] };
  let checked = 0;
  for (const kind of ENTITY_KINDS) {
    const list = unreadable.has(kind) ? [] : ((top[kind] as unknown[] | undefined) ?? []);
    lists[kind] = list;
    const out: unknown[] = [];
    for (let index = 0; index < list.length; index++) {
      const entity = checkEntity(kind, list[index], index, sink);
      if (entity !== undefined) out.push(entity);
      checked++;
      if (turns.due()) yield checked;
    }
    parsed[kind] = out as never;
  }

  yield checked;
  const view = yield* buildView(lists, unreadable, opts.context, turns, checked);
  yield* checkReferences(view, sink, turns, checked);
  yield* findWarnings(view, sink, turns, checked);
  yield checked;

  const { errors, warnings, moreErrors, moreWarnings } = sink.sorted();
  const document = errors.length === 0 ? ({ format: NETWORK_FORMAT, ...parsed } as NetworkDocument) : null;
  return { document, errors, warnings, moreErrors, moreWarnings };
}

/** Checks the top level with the shared shape schema; returns the kinds whose list cannot be read. */
function checkShape(top: Record<string, unknown>, sink: IssueSink): Set<EntityKind> {
  const unreadable = new Set<EntityKind>();
  const result = networkDocumentShape.safeParse(top);
  if (result.success) return unreadable;
  const allowed = Object.keys(networkDocumentShape.shape).join(', ');
  for (const issue of result.error.issues) {
    const key = issue.path[0];
    if (issue.code === 'unrecognized_keys') {
      for (const unknown of issue.keys) {
        sink.documentError('unknown-key', `unknown top-level key "${unknown}": a network document has only ${allowed}`, unknown);
      }
    } else if (key === 'format') {
      sink.documentError('wrong-format', `format must be "${NETWORK_FORMAT}" (got ${shown(top.format)})`, 'format');
    } else if (typeof key === 'string' && (ENTITY_KINDS as readonly string[]).includes(key)) {
      const kind = key as EntityKind;
      if (!unreadable.has(kind)) {
        unreadable.add(kind);
        sink.kindError(kind, 'not-a-list', `${kind} must be a list of ${kind} (got ${shown(top[kind])})`, kind);
      }
    } else {
      sink.documentError('invalid-document', `the document is not valid: ${issue.message}`);
    }
  }
  return unreadable;
}
