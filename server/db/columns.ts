/**
 * Select lists taken from a model's attribute description
 * (server/db/models/inventory.ts): `alias.column AS "attribute"` for each
 * document field, in the model's order. The keys, timestamps and the
 * optimistic-lock version are left out (and references, which a read joins to
 * codes itself), unless asked for.
 */
type Attributes = Record<string, { type: unknown; field?: string }>;

/** Kept by the database and Sequelize, not fields of the document. */
export const BOOKKEEPING: readonly string[] = ['id', 'createdAt', 'updatedAt', 'version'];

const documentAttributes = (attributes: Attributes, leaveOut: readonly string[]) =>
  Object.entries(attributes).filter(([name]) => !BOOKKEEPING.includes(name) && !leaveOut.includes(name));

export function selectList(attributes: Attributes, alias: string, leaveOut: readonly string[] = []): string {
  return documentAttributes(attributes, leaveOut)
    .map(([name, a]) => `${alias}.${'field' in a && a.field ? a.field : name} AS "${name}"`)
    .join(', ');
}

/** The document fields that `selectList` selects, in its order (for rows read as arrays). */
export function selectedFields(attributes: Attributes, leaveOut: readonly string[] = []): string[] {
  return documentAttributes(attributes, leaveOut).map(([name]) => name);
}

/**
 * The sort whitelist of a list: every document field of the model by its
 * column (`alias.column`), plus the last change. A field added to the model
 * can be sorted by without touching the list code.
 */
export function sortList(attributes: Attributes, alias: string, leaveOut: readonly string[] = []): Record<string, string> {
  const sorts: Record<string, string> = {};
  for (const [name, a] of Object.entries(attributes)) {
    if (BOOKKEEPING.includes(name) || leaveOut.includes(name)) continue;
    sorts[name] = `${alias}.${'field' in a && a.field ? a.field : name}`;
  }
  const stamp = attributes.updatedAt;
  if (stamp) sorts.updatedAt = `${alias}.${stamp.field ?? 'updatedAt'}`;
  return sorts;
}

/** A model's table name and the column of one of its attributes, for set-based SQL that must not name them by hand. */
export function tableOf(model: { getTableName(): string | { tableName: string } }): string {
  const name = model.getTableName();
  return typeof name === 'string' ? name : name.tableName;
}

export function columnOf(model: { getAttributes(): Record<string, { field?: string }> }, attribute: string): string {
  const a = model.getAttributes()[attribute];
  if (!a) throw new Error(`the model has no attribute ${attribute}`);
  return a.field ?? attribute;
}
