/**
 * Writes the demo network (an invented region, see demo-region.ts) to
 * test/fixtures/demo-network.json, or to the path given:
 *   npx tsx scripts/generator/demo.ts [--out path]
 */
import fs from 'node:fs';
import path from 'node:path';
import { buildDemoNetwork } from './demo-network';

export const DEMO_FIXTURE = path.resolve(__dirname, '..', '..', 'test', 'fixtures', 'demo-network.json');

/** The fixture's exact text: two-space JSON and a final newline. */
export function demoFixtureText(): string {
  return `${JSON.stringify(buildDemoNetwork(), null, 2)}\n`;
}

function main(argv: string[]): void {
  let out = DEMO_FIXTURE;
  for (let i = 0; i < argv.length; i++) {
    if (argv[i] === '--out' && argv[i + 1]) out = path.resolve(argv[++i]);
    else {
      process.stderr.write('usage: npx tsx scripts/generator/demo.ts [--out path]\n');
      process.exit(2);
    }
  }
  fs.mkdirSync(path.dirname(out), { recursive: true });
  fs.writeFileSync(out, demoFixtureText());
  process.stderr.write(`demo network written to ${out}\n`);
}

if (require.main === module) main(process.argv.slice(2));
