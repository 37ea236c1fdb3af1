/**
 * The JSON export from memory. The in-memory model holds the same document
 * the export would read from PostgreSQL; when the model is at the database's
 * version, its document is serialised once per version and every export of
 * that version sends the same bytes. Fifty engineers exporting at once then
 * cost one serialisation, not fifty reads of the whole database. When the
 * model is behind (a rebuild under way), the export reads PostgreSQL as before.
 */
import type { AppContext } from '../context';
import { loadNetworkDocument } from './networkLoader';

let cached: { version: number; body: Buffer; model: object } | null = null;

export async function exportJson(ctx: AppContext): Promise<{ version: number; body: Buffer }> {
  const model = ctx.network.model;
  if (model) {
    const databaseVersion = await ctx.network.databaseVersion();
    if (model.networkVersion === databaseVersion) {
      if (!cached || cached.model !== model) cached = { version: model.networkVersion, body: Buffer.from(JSON.stringify(withBase(model.document, model.networkVersion))), model };
      return cached;
    }
  }
  const { document, version } = await loadNetworkDocument(ctx.db.sequelize);
  return { version, body: Buffer.from(JSON.stringify(withBase(document, version))) };
}

/** The export says which version it was made from, so a replace-import from it can tell what it would undo. */
function withBase(document: { format: string }, version: number) {
  const { format, ...entities } = document;
  return { format, baseVersion: version, ...entities };
}
