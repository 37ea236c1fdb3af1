import { describe, expect, it } from 'vitest';
import { NetworkEngine, UnknownCarriageError } from '@/server/engine/engine';
import type { ChainNode } from '@/shared/schemas/analysis';
import { valleyNetwork } from './fixtures';

const engine = NetworkEngine.build(valleyNetwork(), 5);
/** A compact picture of a chain tree: carriage, the feed above it, and the marks. */
const outline = (n: ChainNode): unknown => [
  n.carriage,
  n.via ? `${n.via.feed}/${n.via.role}${n.via.up ? '' : '/down'}` : '-',
  ...(n.loop ? ['loop'] : []),
  ...(n.repeated ? ['repeated'] : []),
  ...(n.deadEnd ? ['dead-end'] : []),
  n.children.map(outline),
];

describe('chain', () => {
  it('up: each feed into the carriage, recursively to the origins, main before reserve; a carriage met twice is expanded once', () => {
    const { root, direction, networkVersion } = engine.chain('R3.TV', 'up');
    expect([direction, networkVersion]).toEqual(['up', 5]);
    expect(outline(root)).toEqual([
      'R3.TV', '-', [
        ['R2.TV', 'F07/main', [
          ['R1.TV', 'F04/main', [['M.TV', 'F03/main', 'repeated', []]]],
          ['M.TV', 'F05/reserve', [
            ['O1.TV', 'F01/main', []],
            ['O2.TV', 'F02/reserve', []],
          ]],
        ]],
      ],
    ]);
    expect(root).toMatchObject({ site: 'R3', siteName: 'R3 hill', service: 'TV', origin: false, onAir: true });
    const m = root.children[0].children[1];
    const o1 = m.children[0];
    expect(o1.origin).toBe(true);
    expect(o1.via).toMatchObject({ medium: 'microwave', hops: ['H'], up: true, warnings: [] });
    // O1 (0 N, 0 E) to M (0 N, 1 E) runs along the equator: a * (pi / 180) with the WGS84
    // semi-major axis a = 6378137 m (NIMA TR8350.2), 111.3195 km.
    expect(o1.via!.distanceKm).toBeCloseTo((6378137 * Math.PI) / 180 / 1000, 6);
  });

  it('down: every carriage fed from it', () => {
    expect(outline(engine.chain('M.TV', 'down').root)).toEqual([
      'M.TV', '-', [
        ['R1.TV', 'F03/main', [['R2.TV', 'F04/main', 'repeated', []]]],
        ['R2.TV', 'F05/reserve', [['R3.TV', 'F07/main', []]]],
      ],
    ]);
  });

  it('a loop is cut and marked, and nothing in it is on air', () => {
    const { root } = engine.chain('L1.TV', 'up');
    expect(outline(root)).toEqual(['L1.TV', '-', [['L2.TV', 'F09/main/down', [['L1.TV', 'F08/main/down', 'loop', []]]]]]);
    expect(root.onAir).toBe(false);
  });

  it('an upstream walk ending at a non-origin carriage with no feed is a dead end', () => {
    expect(outline(engine.chain('D.TV', 'up').root)).toEqual(['D.TV', '-', 'dead-end', []]);
    expect(outline(engine.chain('D.TV', 'down').root)).toEqual(['D.TV', '-', []]);
  });

  it('passes screening warnings through per feed', () => {
    const { root } = engine.chain('R1.TV', 'up', { warningsFor: (f) => (f === 'F03' ? ['field strength below the planning minimum'] : []) });
    expect(root.children[0].via!.warnings).toEqual(['field strength below the planning minimum']);
  });

  it('rejects an unknown carriage and a bad direction by name', () => {
    expect(() => engine.chain('NOPE.TV', 'up')).toThrow(UnknownCarriageError);
    expect(() => engine.chain('NOPE.TV', 'up')).toThrow(/unknown carriage: NOPE.TV/);
    expect(() => engine.chain('M.TV', 'sideways' as 'up')).toThrow(/direction is up or down/);
  });
});
