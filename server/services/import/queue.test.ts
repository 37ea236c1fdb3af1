import { describe, expect, it } from 'vitest';
import { ImportQueue } from './queue';

describe('import queue', () => {
  it('runs one at a time in order of arrival, and refuses beyond the waiting room', async () => {
    const q = new ImportQueue(2);
    const order: string[] = [];
    let inside = 0;
    let most = 0;
    const run = async (name: string) => {
      const entered = q.enter();
      if (!entered) return order.push(`${name} refused`);
      const release = await entered;
      inside++;
      most = Math.max(most, inside);
      order.push(name);
      await new Promise((r) => setTimeout(r, 5));
      inside--;
      release();
      release(); // a second release changes nothing
    };
    await Promise.all(['a', 'b', 'c', 'd'].map(run));
    expect(order).toEqual(['d refused', 'a', 'b', 'c']);
    expect(most).toBe(1);
    expect(q.load).toBe(0);
  });
});
