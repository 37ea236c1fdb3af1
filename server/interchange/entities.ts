/**
 * Checks one entity against its zod schema (shared/schemas/network.ts) and
 * turns every zod issue into an import issue with a stable rule name and a
 * sentence a person can act on, quoting the value that was given.
 */
import type { z } from 'zod';
import { entitySchemas, type EntityKind } from '@/shared/schemas/network';
import { isCanonical } from './canonical';
import { codeOf, shown, type IssueSink } from './issues';

type ZodIssue = z.core.$ZodIssue;

/** Returns the parsed entity, or undefined after reporting why it is not valid. */
export function checkEntity<K extends EntityKind>(
  kind: K,
  raw: unknown,
  index: number,
  sink: IssueSink,
): z.output<(typeof entitySchemas)[K]> | undefined {
  if (isCanonical(kind, raw)) return raw as z.output<(typeof entitySchemas)[K]>;
  const result = entitySchemas[kind].safeParse(raw);
  if (result.success) return withoutAbsent(result.data) as z.output<(typeof entitySchemas)[K]>;
  const code = codeOf(raw);
  for (const issue of result.error.issues) {
    if (issue.code === 'unrecognized_keys') {
      const known = Object.keys(entitySchemas[kind].shape).join(', ');
      for (const key of issue.keys) {
        sink.error(kind, index, code, key, 'unknown-field', `unknown field "${key}" (the fields are ${known})`);
      }
      continue;
    }
    const field = pathText(issue.path);
    const value = valueAt(raw, issue.path);
    const { rule, detail } = describe(issue, field, value);
    sink.error(kind, index, code, field || undefined, rule, detail);
  }
  return undefined;
}

/** A null optional field parses to undefined; drop the key so that export and round trips see it absent. */
function withoutAbsent<T extends object>(entity: T): T {
  for (const key of Object.keys(entity)) {
    if ((entity as Record<string, unknown>)[key] === undefined) delete (entity as Record<string, unknown>)[key];
  }
  return entity;
}

function describe(issue: ZodIssue, field: string, value: unknown): { rule: string; detail: string } {
  const got = value === undefined ? '' : ` (got ${shown(value)})`;
  const own = isOwnMessage(issue.message) ? issue.message : undefined;
  switch (issue.code) {
    case 'invalid_type': {
      if (field === '') return { rule: 'wrong-type', detail: `must be an object with fields${got}` };
      if (value === undefined) return { rule: field === 'code' ? 'missing-code' : 'missing-field', detail: `${field} is required` };
      const expected = issue.expected === 'int' ? 'a whole number' : `${article(issue.expected)} ${issue.expected}`;
      return { rule: 'wrong-type', detail: `${field} must be ${expected}${got}` };
    }
    case 'invalid_value':
      return { rule: 'unknown-enum', detail: `${own ?? `${field} is one of ${issue.values.map(String).join(', ')}`}${got}` };
    case 'too_small':
    case 'too_big': {
      if (issue.origin === 'number') {
        const negative = issue.code === 'too_small' && Number(issue.minimum) === 0 && issue.inclusive === true;
        const bound = issue.code === 'too_small' ? `at least ${issue.minimum}` : `at most ${issue.maximum}`;
        return { rule: negative ? 'negative-value' : 'out-of-range', detail: `${own ?? `${field} is ${bound}`}${got}` };
      }
      const size = issue.code === 'too_small' ? `at least ${issue.minimum}` : `at most ${issue.maximum}`;
      return { rule: 'wrong-length', detail: `${own ?? `${field} has ${size} characters`}${got}` };
    }
    case 'invalid_format':
      return { rule: 'invalid-code', detail: `${field}: ${own ?? 'not a valid value'}${got}` };
    default:
      return { rule: 'invalid-value', detail: `${field}: ${own ?? 'not a valid value'}${got}` };
  }
}

/** The schemas' own messages are lower-case sentences; zod's defaults start "Invalid ...", "Too ...". */
function isOwnMessage(message: string): boolean {
  return message.length > 0 && !/^(Invalid|Too |Unrecognized|Expected)/.test(message);
}

function article(word: string): string {
  return /^[aeiou]/i.test(word) ? 'an' : 'a';
}

/** ["groups", 1] -> "groups[1]" */
export function pathText(path: readonly PropertyKey[]): string {
  let text = '';
  for (const part of path) {
    if (typeof part === 'number') text += `[${part}]`;
    else text += text === '' ? String(part) : `.${String(part)}`;
  }
  return text;
}

function valueAt(raw: unknown, path: readonly PropertyKey[]): unknown {
  let value: unknown = raw;
  for (const part of path) {
    if (value === null || typeof value !== 'object') return undefined;
    value = (value as Record<PropertyKey, unknown>)[part];
  }
  return value;
}
