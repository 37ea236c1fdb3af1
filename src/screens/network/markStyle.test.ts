import { describe, expect, it } from 'vitest';
import { colors } from '@/src/theme/colors';
import { contrastRatio } from '@/src/theme/contrast';
import { FAIL_MARK, GROUP_MARK, ROLE_MARK } from './markStyle';

describe('diagram mark styles', () => {
  const drawn = [...Object.values(ROLE_MARK).flatMap((m) => [m.fill, m.stroke]), GROUP_MARK.fill, GROUP_MARK.outer, GROUP_MARK.inner, FAIL_MARK.offStroke, FAIL_MARK.reserveStroke];

  it('never use the accent, which is kept for actions and the current place', () => {
    expect(drawn).not.toContain(colors.accent);
    expect(drawn).not.toContain(colors.accentSoft);
  });

  it('draw a group outline that stands 3:1 from the map and holds its count in readable ink (WCAG 2.1, 1.4.11 and 1.4.3)', () => {
    expect(contrastRatio(GROUP_MARK.outer, colors.surface)).toBeGreaterThanOrEqual(3);
    expect(contrastRatio(GROUP_MARK.outer, colors.sunken)).toBeGreaterThanOrEqual(3);
    expect(contrastRatio(colors.ink, GROUP_MARK.fill)).toBeGreaterThanOrEqual(4.5);
  });

  it('give each site role its own fill beside its own shape', () => {
    const fills = Object.values(ROLE_MARK).map((m) => m.fill);
    expect(new Set(fills).size).toBe(fills.length);
  });
});
