/**
 * Writes a generated network document (scripts/generator):
 *   npm run gen -- --sites 20000 --seed 7 --out net.json
 *   npm run -s gen -- --sites 20000 --seed 7 > net.json
 *   npm run gen -- --sites 500 --seed 1 --format csv --out DIR
 * JSON goes to the file named by --out, else to stdout (then run npm with -s:
 * without it npm prints its own banner lines to stdout ahead of the JSON).
 * CSV writes the five files into the folder DIR.
 */
import fs from 'node:fs';
import path from 'node:path';
import { DEFAULT_FAULT_SHARE, generateNetwork, MAX_SITES } from './generator';
import { documentToCsv } from '@/server/interchange/csv';

const USAGE = `usage: npm run gen -- --sites N --seed S [--faults SHARE] [--format json|csv] [--out FILE|DIR]
  --sites N     number of sites, 1-${MAX_SITES}
  --seed S      whole number; the same seed gives the same network
  --faults      share (0-1) of off-air relay carriages planted as channel clashes
                for the checks to find (default ${DEFAULT_FAULT_SHARE})
  --format      json (default) or csv (five files, needs --out DIR)
  --out         json: the file to write (default: stdout; use npm run -s then)
                csv: the folder for the five files
`;

interface Args {
  sites: number;
  seed: number;
  format: 'json' | 'csv';
  out?: string;
  faultShare?: number;
}

export function parseArgs(argv: readonly string[]): Args | string {
  const values: Record<string, string> = {};
  for (let i = 0; i < argv.length; i++) {
    const flag = argv[i];
    if (!['--sites', '--seed', '--format', '--out', '--faults'].includes(flag)) return `unknown argument "${flag}"`;
    const value = argv[i + 1];
    if (value === undefined || value.startsWith('--')) return `${flag} needs a value`;
    values[flag.slice(2)] = value;
    i++;
  }
  if (values.sites === undefined || values.seed === undefined) return '--sites and --seed are required';
  const sites = Number(values.sites);
  const seed = Number(values.seed);
  if (!/^\d+$/.test(values.sites) || sites < 1 || sites > MAX_SITES) return `--sites must be a whole number from 1 to ${MAX_SITES} (got "${values.sites}")`;
  if (!/^-?\d+$/.test(values.seed)) return `--seed must be a whole number (got "${values.seed}")`;
  const format = values.format ?? 'json';
  if (format !== 'json' && format !== 'csv') return `--format is json or csv (got "${format}")`;
  if (format === 'csv' && values.out === undefined) return '--format csv needs --out DIR';
  const faultShare = values.faults === undefined ? undefined : Number(values.faults);
  if (faultShare !== undefined && !(/^\d*\.?\d+$/.test(values.faults) && faultShare <= 1)) return `--faults must be a share from 0 to 1 (got "${values.faults}")`;
  return { sites, seed, format, out: values.out, ...(faultShare !== undefined ? { faultShare } : {}) };
}

function main(): void {
  const args = parseArgs(process.argv.slice(2));
  if (typeof args === 'string') {
    process.stderr.write(`${args}\n${USAGE}`);
    process.exit(2);
  }
  const started = performance.now();
  const doc = generateNetwork({ sites: args.sites, seed: args.seed, faultShare: args.faultShare });
  const ms = performance.now() - started;
  if (args.format === 'csv') {
    const out = path.resolve(args.out as string);
    fs.mkdirSync(out, { recursive: true });
    const files = documentToCsv(doc);
    for (const [name, text] of Object.entries(files)) fs.writeFileSync(path.join(out, name), text);
    process.stderr.write(`wrote ${Object.keys(files).join(', ')} to ${out}\n`);
  } else if (args.out !== undefined) {
    const out = path.resolve(args.out);
    if (fs.existsSync(out) && fs.statSync(out).isDirectory()) {
      process.stderr.write(`--out ${args.out} is a folder: give the name of the JSON file to write\n`);
      process.exit(2);
    }
    fs.mkdirSync(path.dirname(out), { recursive: true });
    fs.writeFileSync(out, `${JSON.stringify(doc)}\n`);
    process.stderr.write(`wrote ${out}\n`);
  } else {
    process.stdout.write(JSON.stringify(doc));
    process.stdout.write('\n');
  }
  process.stderr.write(
    `${doc.sites.length} sites, ${doc.services.length} services, ${doc.groups.length} groups, ` +
      `${doc.carriages.length} carriages, ${doc.feeds.length} feeds; generated in ${ms.toFixed(0)} ms\n`,
  );
}

if (require.main === module) main();
