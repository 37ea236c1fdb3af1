/**
 * `npm run gen` end to end: the JSON it writes parses, whether it goes to a
 * file (--out) or through npm's stdout (npm run -s, which keeps npm's own
 * banner lines out of the output).
 */
import { execFileSync, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import type { NetworkDocument } from '@/shared/schemas/network';
import { validateDocument } from '@/server/interchange/validate';
import { generateNetwork } from './index';

const ROOT = path.resolve(__dirname, '..', '..');
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'gen-cli-'));
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

const expected = JSON.stringify(generateNetwork({ sites: 40, seed: 9 }));

describe('npm run gen', () => {
  it('--out FILE writes the document as JSON to that file, and nothing to stdout', () => {
    const out = path.join(dir, 'nested', 'net.json');
    const stdout = execFileSync('npm', ['run', 'gen', '--', '--sites', '40', '--seed', '9', '--out', out], { cwd: ROOT, encoding: 'utf8' });
    const text = fs.readFileSync(out, 'utf8');
    expect(JSON.stringify(JSON.parse(text))).toBe(expected);
    expect(validateDocument(JSON.parse(text) as NetworkDocument).errors).toEqual([]);
    expect(stdout).not.toContain('"format"');
  }, 60_000);

  it('npm run -s gen writes JSON alone on stdout, so a redirect gives a valid file', () => {
    const stdout = execFileSync('npm', ['run', '-s', 'gen', '--', '--sites', '40', '--seed', '9'], { cwd: ROOT, encoding: 'utf8' });
    expect(JSON.stringify(JSON.parse(stdout))).toBe(expected);
  }, 60_000);

  it('refuses --out naming a folder for JSON, with a message and exit code 2', () => {
    const run = spawnSync('npx', ['tsx', 'scripts/gen.ts', '--sites', '5', '--seed', '1', '--out', dir], { cwd: ROOT, encoding: 'utf8' });
    expect(run.status).toBe(2);
    expect(run.stderr).toContain('is a folder');
    expect(fs.readdirSync(dir)).toEqual(['nested']);
  }, 60_000);
});
