import { describe, expect, it } from 'vitest';
import { Turns } from './turns';

const dueCount = (turns: Turns, calls: number) => {
  let n = 0;
  for (let i = 0; i < calls; i++) if (turns.due()) n++;
  return n;
};

describe('Turns', () => {
  it('is due once the turn has lasted its time, reading the clock once every 64 calls', () => {
    expect(dueCount(new Turns(0), 640)).toBe(10);
    expect(dueCount(new Turns(60_000), 100_000)).toBe(0);
  });

  it('starts a new turn when it says one is due', async () => {
    const turns = new Turns(5);
    await new Promise((resolve) => setTimeout(resolve, 10));
    expect(dueCount(turns, 64)).toBe(1);
    expect(dueCount(turns, 64)).toBe(0);
  });
});
