import { describe, expect, it } from 'vitest';
import { colors } from '@/src/theme/colors';
import { plainStrokes } from './denseLines';

describe('plainStrokes (dense view)', () => {
  it('draws main as one line and reserve as a double line: two strokes, a background core inside a wider one', () => {
    const main = plainStrokes('main');
    const reserve = plainStrokes('reserve');
    expect(main).toHaveLength(1);
    expect(reserve).toHaveLength(2);
    const [outer, core] = reserve;
    expect(core.stroke).toBe(colors.surface);
    // Both rails of the double line stay at least about one px wide beside the core.
    expect((outer.width - core.width) / 2).toBeGreaterThanOrEqual(0.8);
  });

  it('tells the roles apart without colour: same shape rules with every colour made one grey', () => {
    const shape = (role: 'main' | 'reserve') => plainStrokes(role).map((l) => ({ width: l.width, core: l.stroke === colors.surface }));
    expect(shape('main')).not.toEqual(shape('reserve'));
  });
});
