/**
 * The audit screen's pure parts: the API path of one page (GET /api/audit,
 * server/routes/network.ts), and the field-by-field difference between a
 * record before and after a change.
 */
import { api } from '@/shared/api';
import { AUDIT_KINDS } from '@/src/api/schemas';

export const AUDIT_PAGE_SIZE = 25;
export type AuditKindFilter = (typeof AUDIT_KINDS)[number];

export interface AuditFilter {
  page: number;
  kind?: AuditKindFilter;
}

export function auditFilterFromParams(params: Record<string, string | string[] | undefined>): AuditFilter {
  const first = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);
  const page = Number(first(params.page));
  const kind = first(params.kind);
  return {
    page: Number.isInteger(page) && page >= 1 ? page : 1,
    kind: (AUDIT_KINDS as readonly string[]).includes(kind ?? '') ? (kind as AuditKindFilter) : undefined,
  };
}

export function auditApiPath(filter: AuditFilter, pageSize = AUDIT_PAGE_SIZE): string {
  const parts = [`page=${filter.page}`, `pageSize=${pageSize}`];
  if (filter.kind) parts.push(`kind=${encodeURIComponent(filter.kind)}`);
  return `${api.audit}?${parts.join('&')}`;
}

export interface FieldChange {
  field: string;
  before: string;
  after: string;
  changed: boolean;
}

/** A value as one line of text: absent is "—", lists joined by "; ", objects as compact JSON. */
export function showValue(value: unknown): string {
  if (value === undefined || value === null) return '—';
  if (Array.isArray(value)) return value.length ? value.map(showValue).join('; ') : '—';
  if (typeof value === 'object') return JSON.stringify(value);
  return String(value);
}

const asRecord = (v: unknown): Record<string, unknown> => (v && typeof v === 'object' && !Array.isArray(v) ? (v as Record<string, unknown>) : {});

/**
 * Every field of either side, marked changed when its text differs. Fields
 * named in `order` come first in that order, the rest as first seen (before,
 * then after): the log keeps records as JSON, whose key order is the
 * database's, not the document's. For a create or delete one side is empty,
 * so every field shows as changed.
 */
export function fieldChanges(before: unknown, after: unknown, order: readonly string[] = []): FieldChange[] {
  const b = asRecord(before);
  const a = asRecord(after);
  const seen = [...new Set([...Object.keys(b), ...Object.keys(a)])];
  const rank = (f: string) => (order.includes(f) ? order.indexOf(f) : order.length + seen.indexOf(f));
  const names = [...seen].sort((x, y) => rank(x) - rank(y));
  return names.map((field) => {
    const x = showValue(b[field]);
    const y = showValue(a[field]);
    return { field, before: x, after: y, changed: x !== y };
  });
}
