/**
 * Peak memory (RSS) of reading and checking the largest imports the upload
 * limits allow (server/interchange/limits.ts), each in a fresh process:
 *   npx tsx scripts/measure-import-memory.ts
 * "generated": a 20,000-site generated network as a zip of its CSV files;
 * "widest": the byte limit filled with the row limit of site rows (the most
 * entities per byte the limits let through). Not part of npm test.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { buildZip } from '@/test/helpers/zip';
import { documentToCsv } from '@/server/interchange/csv';
import { UPLOAD_LIMITS } from '@/server/interchange/limits';
import { readUploads } from '@/server/interchange/upload';
import { validateDocument } from '@/server/interchange/validate';
import { generateNetwork } from './generator';

const mb = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(0)} MB`;

function upload(scenario: string): Buffer {
  if (scenario === 'generated') {
    const files = documentToCsv(generateNetwork({ sites: 20_000, seed: 7 }));
    return buildZip(Object.entries(files).map(([name, data]) => ({ name, data })));
  }
  const rows = UPLOAD_LIMITS.maxRecords - 1;
  const pad = Math.floor(UPLOAD_LIMITS.maxBytes / rows) - 40;
  const lines = ['code,name,role,lat,lon'];
  for (let i = 0; i < rows; i++) lines.push(`S${i},${'n'.repeat(Math.min(pad, 190))} ${i},relay,0,0`);
  return buildZip([{ name: 'sites.csv', data: lines.join('\n') }]);
}

async function child(scenario: string, file: string) {
  const before = process.memoryUsage().rss;
  const started = Date.now();
  // the zip buffer is only referenced by the call, so it can be collected while the document is checked
  const read = await readUploads([{ name: 'net.zip', data: fs.readFileSync(file) }]);
  const result = validateDocument(read.raw, { rowsOf: read.rowsOf });
  const took = Date.now() - started;
  const peak = process.resourceUsage().maxRSS * 1024;
  const records = Object.values(read.rowsOf ?? {}).reduce((n, r) => n + (r?.rows.length ?? 0), 0);
  console.log(`${scenario}: ${records.toLocaleString('en')} records, ${result.errors.length} errors; read+check ${(took / 1000).toFixed(1)} s; RSS before ${mb(before)}, peak ${mb(peak)}`);
}

const [scenario, file] = process.argv.slice(2);
if (scenario && file) {
  void child(scenario, file);
} else {
  // the uploads are made here, so that the measuring process holds nothing but the upload
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'import-memory-'));
  for (const s of ['generated', 'widest']) {
    const zipFile = path.join(dir, `${s}.zip`);
    fs.writeFileSync(zipFile, upload(s));
    console.log(`${s}: upload ${mb(fs.statSync(zipFile).size)} zipped`);
    process.stdout.write(execFileSync(process.execPath, ['--import', 'tsx', __filename, s, zipFile], { encoding: 'utf8', maxBuffer: 1 << 20 }));
  }
  fs.rmSync(dir, { recursive: true });
}
