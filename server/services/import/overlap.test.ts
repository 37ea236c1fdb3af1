import { describe, expect, it } from 'vitest';
import type { ImportProgress } from '@/shared/schemas/import';
import { OverlappedWrite } from './overlap';

const tick = () => new Promise<void>((resolve) => setImmediate(resolve));

/** A write of `slices` steps, one per turn of the event loop, that stops at its signal like the importer's. */
function slowWrite(writing: OverlappedWrite<string>, slices: number, log: string[]) {
  return async () => {
    log.push('write started');
    for (let i = 1; i <= slices; i++) {
      await tick();
      // reports before it asks the signal, as the importer's step does
      writing.progress({ stage: 'writing', done: i, total: slices });
      writing.signal.throwIfAborted();
    }
    log.push('write done');
    return 'written';
  };
}

describe('a write overlapped with the checks', () => {
  it('holds the write\'s progress until the checks are done, then passes on the latest and the rest', async () => {
    const heard: ImportProgress[] = [];
    const writing = new OverlappedWrite<string>({ onProgress: (p) => heard.push(p) });
    const log: string[] = [];
    writing.start(slowWrite(writing, 10, log));
    for (let i = 0; i < 4; i++) await tick();
    expect(heard).toEqual([]);
    const result = await writing.afterChecks(async () => 'a second write');
    expect(result).toBe('written');
    expect(log).toEqual(['write started', 'write done']);
    expect(heard[0].done).toBeGreaterThanOrEqual(3);
    expect(heard.at(-1)).toEqual({ stage: 'writing', done: 10, total: 10 });
    expect(heard.map((p) => p.done)).toEqual([...heard.map((p) => p.done)].sort((a, b) => a - b));
  });

  it('stops a started write when the checks fail, waits for it to let go, and passes on none of its progress', async () => {
    const heard: ImportProgress[] = [];
    const writing = new OverlappedWrite<string>({ onProgress: (p) => heard.push(p) });
    const log: string[] = [];
    writing.start(slowWrite(writing, 1000, log));
    for (let i = 0; i < 3; i++) await tick();
    await writing.stop();
    expect(log).toEqual(['write started']);
    expect(writing.signal.aborted).toBe(true);
    expect(heard).toEqual([]);
  });

  it('writes after the checks when nothing started early, and hands on the write\'s own failure', async () => {
    const writing = new OverlappedWrite<string>({});
    await expect(writing.afterChecks(async () => 'late')).resolves.toBe('late');
    const failing = new OverlappedWrite<string>({});
    failing.start(async () => {
      throw new Error('refused by the database');
    });
    await tick();
    await expect(failing.afterChecks(async () => 'never')).rejects.toThrow('refused by the database');
  });

  it('stops with the import\'s own signal too (the client gone)', async () => {
    const client = new AbortController();
    const writing = new OverlappedWrite<string>({ signal: client.signal });
    client.abort(new Error('client gone'));
    expect(writing.signal.aborted).toBe(true);
    expect(() => writing.signal.throwIfAborted()).toThrow('client gone');
  });
});
