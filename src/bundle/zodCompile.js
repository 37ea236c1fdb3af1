// Stands in for zod's schema compiler (z.core.compile: a schema turned into a
// standalone parser) in the web bundle (standIns.js): the app only parses
// with its schemas, and zod's index brings the compiler whether or not it is
// called (about 8 kB of compressed script on the first screen).
function notBundled() {
  throw new Error("zod's schema compiler is not part of the web app bundle (src/bundle/README.md)");
}
export const INVALID = Symbol.for('zod.compile.invalid');
export class ZodCompileAsyncError extends Error {}
export class ZodCompileUnsupportedError extends Error {}
export const compile = notBundled;
export const withParser = notBundled;
export const compileFn = notBundled;
