import { describe, expect, it } from 'vitest';
import { MEDIA, FEED_ROLES } from '@/shared/schemas/network';
import { feedStrokes, feedWords, MEDIUM_ORDER } from './feedStyle';

describe('feedStrokes', () => {
  it('refuses an unknown medium', () => {
    expect(() => feedStrokes('pigeon' as never, 'main')).toThrow(/unknown medium "pigeon"/);
  });

  it('covers every medium of the network document', () => {
    expect([...MEDIUM_ORDER].sort()).toEqual([...MEDIA].sort());
  });

  it('gives every medium and role pair a different drawing', () => {
    const seen = new Set<string>();
    for (const m of MEDIA) {
      for (const r of FEED_ROLES) {
        const layers = feedStrokes(m, r);
        // Ignore colour: the pattern (dash + layering + width) alone must tell them apart.
        seen.add(JSON.stringify(layers.map((l) => [l.width, l.dash ?? 'solid'])));
      }
    }
    expect(seen.size).toBe(MEDIA.length * FEED_ROLES.length);
  });

  it('draws a reserve as a double line: a wide stroke with a background stroke inside', () => {
    const layers = feedStrokes('line', 'reserve', 1, '#FFFFFF');
    expect(layers).toHaveLength(2);
    expect(layers[1].stroke).toBe('#FFFFFF');
    expect(layers[1].width).toBeLessThan(layers[0].width);
    expect(feedStrokes('line', 'main')).toHaveLength(1);
  });

  it('scales dashes with the stroke', () => {
    const thin = feedStrokes('satellite', 'main', 1)[0].dash!;
    const thick = feedStrokes('satellite', 'main', 3)[0].dash!;
    expect(thin).toBe('10 5');
    expect(thick).toBe('30 15');
  });
});

describe('feedWords', () => {
  it('says medium and role', () => {
    expect(feedWords('off-air', 'reserve')).toBe('off-air, reserve feed');
  });
});
