/**
 * The supervisor behind npm start: a child that crashes is started again,
 * with the reason logged and a back-off that grows, and resets once the child
 * stayed up; stop() ends the child and restarts nothing more.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { supervise } from '@/scripts/lib/supervisor';

const waitFor = async (what: string, ok: () => boolean, ms = 15_000) => {
  const t0 = Date.now();
  while (!ok()) {
    if (Date.now() - t0 > ms) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 20));
  }
};

/** A child that counts its starts in a file and crashes on the starts listed in CRASH (else stays up for STAY ms, then crashes). */
const CHILD = `
const fs = require('fs');
const n = Number(fs.existsSync(process.env.COUNT) ? fs.readFileSync(process.env.COUNT, 'utf8') : 0) + 1;
fs.writeFileSync(process.env.COUNT, String(n));
if (process.env.CRASH.split(',').includes(String(n))) { console.error('boom: start ' + n + ' ran out of luck'); process.exit(3); }
process.on('SIGTERM', () => { fs.writeFileSync(process.env.COUNT + '.term', 'yes'); process.exit(0); });
setTimeout(() => { console.error('boom: start ' + n + ' fell over later'); process.exit(4); }, Number(process.env.STAY));
`;

function run(crash: string, stayMs: number, opts: { stableAfterMs: number }) {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'headwater-supervisor-'));
  const count = path.join(dir, 'count');
  const logs: string[] = [];
  const sup = supervise({
    command: process.execPath,
    args: ['-e', CHILD],
    env: { ...process.env, COUNT: count, CRASH: crash, STAY: String(stayMs) },
    minDelayMs: 50,
    maxDelayMs: 400,
    stableAfterMs: opts.stableAfterMs,
    log: (m) => logs.push(m),
  });
  const starts = () => (fs.existsSync(count) ? Number(fs.readFileSync(count, 'utf8')) : 0);
  return { sup, logs, starts, count };
}

describe('supervise', () => {
  it('restarts a crashing child with a doubling back-off and the reason in the log, and stop() ends it', async () => {
    const { sup, logs, starts, count } = run('1,2,3,4', 600_000, { stableAfterMs: 60_000 });
    await waitFor('the fifth start', () => starts() === 5 && sup.child !== null);
    expect(sup.restarts).toBe(4);
    expect(sup.delays).toEqual([50, 100, 200, 400]);
    expect(logs).toHaveLength(4);
    expect(logs[0]).toMatch(/exited with code 3 after \d+\.\d s; last words: boom: start 1 ran out of luck\. Starting it again in 0\.1 s\./);
    expect(logs[3]).toMatch(/boom: start 4 ran out of luck/);

    await sup.stop();
    expect(fs.readFileSync(`${count}.term`, 'utf8')).toBe('yes');
    expect(sup.child).toBeNull();
    await new Promise((r) => setTimeout(r, 600));
    expect(starts()).toBe(5);
    expect(sup.restarts).toBe(4);
  });

  it('starts the back-off over after the child stayed up for the stable period', async () => {
    // starts 1 and 2 crash at once; 3 and 4 stay up 3.5 s (longer than stable), then fall over
    const { sup, logs, starts } = run('1,2', 3500, { stableAfterMs: 3000 });
    await waitFor('the fifth start', () => starts() >= 5, 30_000);
    await sup.stop();
    expect(sup.delays.slice(0, 4)).toEqual([50, 100, 50, 50]);
    expect(logs[2]).toMatch(/exited with code 4 after [3-9]\.\d s; last words: boom: start 3 fell over later/);
  });

  it('stop() during the back-off restarts nothing', async () => {
    const { sup, starts } = run('1,2,3,4,5,6', 600_000, { stableAfterMs: 60_000 });
    await waitFor('the first crash', () => sup.delays.length === 1);
    await sup.stop();
    const n = starts();
    await new Promise((r) => setTimeout(r, 300));
    expect(starts()).toBe(n);
    expect(sup.child).toBeNull();
  });
});
