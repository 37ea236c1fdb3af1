/**
 * A small seeded pseudo-random generator, so a seed always gives the same
 * network. mulberry32 (Tommy Ettinger, public domain, 2017): a 32-bit state
 * with a period of 2^32, plenty for test data; not for anything secret.
 */
export class Prng {
  private state: number;

  constructor(seed: number) {
    if (!Number.isFinite(seed)) throw new RangeError(`seed must be a finite number (got ${String(seed)})`);
    this.state = Math.trunc(seed) >>> 0;
  }

  /** A float in [0, 1). */
  next(): number {
    this.state = (this.state + 0x6d2b79f5) >>> 0;
    let t = this.state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  }

  /** A float in [min, max). */
  between(min: number, max: number): number {
    return min + (max - min) * this.next();
  }

  /** A whole number in [min, max], both included. */
  int(min: number, max: number): number {
    return min + Math.floor(this.next() * (max - min + 1));
  }

  /** Spread evenly on a log scale: right for powers and populations, which span decades. */
  logBetween(min: number, max: number): number {
    return Math.exp(this.between(Math.log(min), Math.log(max)));
  }

  chance(p: number): boolean {
    return this.next() < p;
  }

  pick<T>(items: readonly T[]): T {
    if (items.length === 0) throw new RangeError('cannot pick from an empty list');
    return items[Math.floor(this.next() * items.length)];
  }
}
