/**
 * Where a refused write's message goes (server/routes/inventory.ts and
 * server/services/inventory/write.ts):
 *   400 { details: [{ field, message }] }          bad field values
 *   422 { details: [{ field, rule, message }] }    broken rules between records
 *   409 { details: [{ field, rule, message }] }    a clash with a stored record
 *   409 { details: { code } }                      the code is taken
 *   409 { details: { currentVersion, current } }   someone changed it since it was read
 * Field names may point into a list ("groups[1]"); the message goes under the
 * list's field. Anything not about a known field goes above the form.
 */
import { isApiError } from '@/src/api/client';
import { rootField, type Entity, type FieldErrors } from './formValues';

export interface ServerRefusal {
  fields: FieldErrors;
  /** a message for the whole form */
  form?: string;
  /** set when the record changed since it was opened: the current stored record, when the server sent it */
  stale?: { currentVersion?: number; current?: Entity };
}

const isRecord = (v: unknown): v is Record<string, unknown> => !!v && typeof v === 'object' && !Array.isArray(v);

export const STALE_MESSAGE = 'Someone changed this since you opened it.';

export function refusalFromError(error: unknown, knownFields: readonly string[]): ServerRefusal {
  if (!isApiError(error)) {
    return { fields: {}, form: error instanceof Error && error.message ? error.message : 'The change could not be saved. Try again.' };
  }
  if (error.status === 403) return { fields: {}, form: 'Your role does not allow changing the network.' };
  if (error.status === 0) return { fields: {}, form: error.message };
  const details = error.details;

  if (error.status === 409 && isRecord(details) && typeof details.currentVersion === 'number') {
    return {
      fields: {},
      form: STALE_MESSAGE,
      stale: { currentVersion: details.currentVersion, current: isRecord(details.current) ? details.current : undefined },
    };
  }
  if (error.status === 409 && isRecord(details) && typeof details.code === 'string' && knownFields.includes('code')) {
    return { fields: { code: error.message } };
  }

  const fields: FieldErrors = {};
  const unplaced: string[] = [];
  if (Array.isArray(details)) {
    for (const d of details) {
      if (!isRecord(d) || typeof d.message !== 'string') continue;
      const field = typeof d.field === 'string' ? rootField(d.field) : '';
      if (knownFields.includes(field)) fields[field] ??= d.message;
      else unplaced.push(d.message);
    }
  }
  if (Object.keys(fields).length === 0) return { fields, form: unplaced[0] ?? error.message };
  return unplaced.length ? { fields, form: unplaced.join(' ') } : { fields };
}
