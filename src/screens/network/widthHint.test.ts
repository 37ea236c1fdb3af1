import { describe, expect, it } from 'vitest';
import { rememberDiagramWidth, rememberedDiagramWidth } from './widthHint';

const memory = () => {
  const m = new Map<string, string>();
  return { getItem: (k: string) => m.get(k) ?? null, setItem: (k: string, v: string) => void m.set(k, v), m };
};

describe('the remembered diagram width', () => {
  it('is given back for a window of the same width only', () => {
    const s = memory();
    expect(rememberedDiagramWidth(1440, s)).toBe(0);
    rememberDiagramWidth(1440, 1187, s);
    expect(rememberedDiagramWidth(1440, s)).toBe(1187);
    expect(rememberedDiagramWidth(1439, s)).toBe(0);
    rememberDiagramWidth(390, 356, s);
    expect(rememberedDiagramWidth(390, s)).toBe(356);
    expect(rememberedDiagramWidth(1440, s)).toBe(0); // the last window only
  });

  it('reads anything odd as not known, and survives storage that refuses', () => {
    const s = memory();
    for (const bad of ['not json', '{"window":1440,"width":"wide"}', '{"window":1440,"width":2000}', '{"window":1440,"width":-3}', '{"window":1440,"width":10.5}', 'null']) {
      s.m.set('headwater.diagramWidth.v1', bad);
      expect(rememberedDiagramWidth(1440, s)).toBe(0);
    }
    rememberDiagramWidth(1440, 0, s); // nothing measured: nothing kept
    expect(s.m.get('headwater.diagramWidth.v1')).toBe('null');
    const refusing = {
      getItem: () => {
        throw new Error('denied');
      },
      setItem: () => {
        throw new Error('denied');
      },
    };
    expect(rememberedDiagramWidth(1440, refusing)).toBe(0);
    expect(() => rememberDiagramWidth(1440, 1000, refusing)).not.toThrow();
    expect(rememberedDiagramWidth(1440, null)).toBe(0);
  });
});
