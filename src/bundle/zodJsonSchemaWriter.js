// Stands in for zod's JSON Schema writer (to-json-schema.js and
// json-schema-processors.js) in the web bundle (standIns.js). The server
// writes the API's JSON Schema in Node with the full zod; the client only
// parses. Each schema keeps a hook that would call the writer, and zod's
// number and string schemas read their limits back through it (`.minLength`,
// `.isInt`, `.format`...): no client code reads those, and reading one here
// throws this error rather than answering wrong.
function notBundled() {
  throw new Error("zod's JSON Schema writer is not part of the web app bundle (src/bundle/README.md)");
}
const method = () => notBundled;

// to-json-schema.js
export const initializeContext = notBundled;
export const handleUnrepresentable = notBundled;
export const processSchema = notBundled;
export { processSchema as process };
export const extractDefs = notBundled;
export const finalize = notBundled;
export const createToJSONSchemaMethod = method;
export const createStandardJSONSchemaMethod = method;

// json-schema-processors.js (its per-type processors are only called by the writer)
export const aggregateChecks = notBundled;
export const toJSONSchema = notBundled;
export const allProcessors = {};
