/**
 * A field added to a record is added to its migration, its model
 * (server/db/models/inventory.ts), its zod schema (shared/schemas/network.ts)
 * and its form, and nowhere else: every reader and writer of one record, the
 * import writers and the lists take their columns from the model. This pins
 * the half a unit test can see: the model and the schema describe the same
 * fields, so a field added to one and not the other fails here. (The API
 * test "answers every field the model and the schema name" in
 * test/api/inventory.test.ts checks the answers.)
 */
import { Sequelize } from 'sequelize';
import { beforeAll, describe, expect, it } from 'vitest';
import { ENTITY_KINDS, entitySchemas, type EntityKind } from '@/shared/schemas/network';
import { BOOKKEEPING } from '@/server/db/columns';
import { defineInventory } from '@/server/db/models/inventory';
import { MODELS, REFERENCES } from '@/server/services/inventory/records';
import { writtenColumns } from '@/server/services/inventory/tables';

/** The document fields a kind's model describes: its own attributes (references by their document name) and its link lists. */
function modelFields(kind: EntityKind): string[] {
  const model = MODELS[kind];
  const references = REFERENCES[kind] ?? [];
  const own = Object.keys(model.getAttributes())
    .filter((name) => !BOOKKEEPING.includes(name))
    .map((name) => references.find((r) => r.attribute === name)?.field ?? name);
  // lists held in link models: the groups a site or feed is in (a group's members are listed on
  // the members' side, not in the group's document), and a feed's ordered hops as `via`
  const links = Object.values(model.associations).flatMap((a) =>
    a.associationType === 'BelongsToMany' && a.as === 'groups' ? ['groups'] : a.associationType === 'HasMany' && a.as === 'viaSites' ? ['via'] : [],
  );
  return [...own, ...links].sort();
}

const schemaFields = (kind: EntityKind) => Object.keys(entitySchemas[kind].shape).sort();

beforeAll(() => {
  // the models need an instance to be defined; nothing here connects to it
  defineInventory(new Sequelize('postgres://nobody@127.0.0.1:9/none', { logging: false, define: { underscored: true } }));
});

describe('each record kind: the model and the zod schema name the same fields', () => {
  for (const kind of ENTITY_KINDS) {
    it(kind, () => {
      const model = modelFields(kind);
      const schema = schemaFields(kind);
      expect(model.filter((f) => !schema.includes(f)), `in the ${kind} model but not its schema`).toEqual([]);
      expect(schema.filter((f) => !model.includes(f)), `in the ${kind} schema but not its model`).toEqual([]);
    });
  }

  it('the import writers write every column the model has', () => {
    for (const kind of ENTITY_KINDS) {
      const columns = writtenColumns(kind).map((c) => c.field);
      const own = modelFields(kind).filter((f) => !['groups', 'via'].includes(f));
      expect(columns.sort(), kind).toEqual(own);
    }
  });
});
