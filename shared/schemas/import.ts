/** The import report (docs/format.md, "Import rules"). */
import type { EntityKind } from './network';

export interface ImportIssue {
  /** which part of the document: an entity kind, or 'document' for the whole */
  kind: EntityKind | 'document';
  /** 0-based position in the JSON array */
  index?: number;
  /** 1-based CSV data row (header excluded) */
  row?: number;
  /** CSV file name the row came from */
  file?: string;
  code?: string;
  field?: string;
  /** a stable machine name of the rule, e.g. "unknown-reference", "duplicate-code" */
  rule: string;
  /** a sentence a person can act on */
  message: string;
}

/** A report lists at most this many errors and this many warnings; the rest are counted (moreErrors, moreWarnings). */
export const MAX_REPORTED_ISSUES = 1000;

export interface StaleBase {
  /** the version the document was made from */
  baseVersion: number;
  /** the version stored now */
  currentVersion: number;
  /** changes recorded since baseVersion (an import counted by the records it changed) */
  changesSince: number;
}

export interface KindCounts {
  received: number;
  created: number;
  updated: number;
  unchanged: number;
  deleted: number;
}

export interface ImportReport {
  ok: boolean;
  dryRun: boolean;
  replace: boolean;
  counts: Record<EntityKind, KindCounts>;
  errors: ImportIssue[];
  warnings: ImportIssue[];
  /** errors found beyond the MAX_REPORTED_ISSUES listed ("and 4,512 more") */
  moreErrors?: number;
  /** warnings found beyond the MAX_REPORTED_ISSUES listed */
  moreWarnings?: number;
  /**
   * Set when a replace-import comes from an older network version than the
   * stored one: carrying it out would undo the changes made since, so it
   * needs undoNewer=true (server/interchange/README.md "Versions").
   */
  stale?: StaleBase;
  /**
   * The dry run of a replace: the value the commit must send as
   * `confirmReplace`, standing for the deletions counted here at this
   * network version (server/services/import/confirmReplace.ts).
   */
  confirmReplace?: string;
  /** the network version after the import (unchanged on a dry run or an error) */
  networkVersion?: number;
}

/**
 * Where a running import is (GET /api/network/import/progress/:id): not
 * heard of yet (pending: its upload is still on the way), the upload being read, the document checked, the rows written, the served
 * network rebuilt, then done or failed. `done` of `total` counts entities
 * (reading: files; rebuilding: 0 of 1 until it is built).
 */
export const IMPORT_STAGES = ['pending', 'reading', 'validating', 'writing', 'rebuilding', 'done', 'failed'] as const;
export type ImportStage = (typeof IMPORT_STAGES)[number];

export interface ImportProgress {
  stage: ImportStage;
  done: number;
  total: number;
}
