/**
 * Select lists taken from a model's attribute description
 * (server/db/models/inventory.ts): `alias.column AS "attribute"` for each
 * document field, in the model's order. The keys, timestamps and the
 * optimistic-lock version are left out (and references, which a read joins to
 * codes itself), unless asked for.
 */
type Attributes = Record<string, { type: unknown; field?: string }>;

const BOOKKEEPING = ['id', 'createdAt', 'updatedAt', 'version'];

export function selectList(attributes: Attributes, alias: string, leaveOut: readonly string[] = []): string {
  return Object.entries(attributes)
    .filter(([name]) => !BOOKKEEPING.includes(name) && !leaveOut.includes(name))
    .map(([name, a]) => `${alias}.${'field' in a && a.field ? a.field : name} AS "${name}"`)
    .join(', ');
}
