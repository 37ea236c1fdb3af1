/** Command-line options of the scripts: `--name value`. */

/** A whole number >= 1 given as `--name N`, or the fallback when the option is absent. */
export function wholeArgument(name: string, fallback: number): number {
  const i = process.argv.indexOf(`--${name}`);
  if (i < 0) return fallback;
  const v = Number(process.argv[i + 1]);
  if (!Number.isInteger(v) || v < 1) throw new Error(`--${name} needs a whole number >= 1 (got ${String(process.argv[i + 1])})`);
  return v;
}
