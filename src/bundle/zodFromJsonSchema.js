// Stands in for zod's JSON Schema reader in the web app's bundle
// (metro.config.js): the client builds its schemas in code and never reads
// JSON Schema, so the reader is left out of the first screen's script.
export function fromJSONSchema() {
  throw new Error('fromJSONSchema is not part of the web app bundle (see metro.config.js)');
}
