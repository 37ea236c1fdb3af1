import { describe, expect, it } from 'vitest';
import { crossShape, halfShape, linkPaths, siteShape } from './diagramPaths';
import type { DiagramLink } from './diagramModel';

describe('linkPaths', () => {
  const xs = Float64Array.from([0, 10, 20]);
  const ys = Float64Array.from([0, 5, 0]);
  const links: DiagramLink[] = [
    { from: 0, to: 1, medium: 'line', role: 'main', feeds: 2 },
    { from: 1, to: 2, medium: 'line', role: 'main', feeds: 1 },
    { from: 0, to: 2, medium: 'satellite', role: 'reserve', feeds: 1 },
  ];

  it('groups the visible links by style, in screen px', () => {
    const paths = linkPaths(xs, ys, links, [0, 1, 2], { k: 2, tx: 1, ty: -1 });
    expect(paths.get('line|main')).toBe('M1 -1L21 9M21 9L41 -1');
    expect(paths.get('satellite|reserve')).toBe('M1 -1L41 -1');
  });

  it('cuts lines to the clip box and drops those outside it', () => {
    const paths = linkPaths(xs, ys, links, [0, 1, 2], { k: 1, tx: 0, ty: 0 }, { x0: 0, y0: 0, x1: 15, y1: 10 });
    expect(paths.get('line|main')).toBe('M0 0L10 5M10 5L15 2.5');
    expect(paths.get('satellite|reserve')).toBe('M0 0L15 0');
    expect(linkPaths(xs, ys, links, [0], { k: 1, tx: 0, ty: 0 }, { x0: 50, y0: 50, x1: 60, y1: 60 }).size).toBe(0);
  });

  it('draws only the given indices', () => {
    const paths = linkPaths(xs, ys, links, [2], { k: 1, tx: 0, ty: 0 });
    expect([...paths.keys()]).toEqual(['satellite|reserve']);
  });
});

describe('site marks', () => {
  it('draws a square, a diamond and a circle for origin, main and relay', () => {
    expect(siteShape('origin', 10, 10, 3)).toBe('M7 7h6v6h-6z');
    expect(siteShape('main', 10, 10, 2)).toBe('M10 7.3l2.7 2.7l-2.7 2.7l-2.7 -2.7z');
    expect(siteShape('relay', 10, 10, 2)).toBe('M8 10a2 2 0 1 0 4 0a2 2 0 1 0 -4 0z');
  });

  it('draws the status marks', () => {
    expect(crossShape(5, 5, 1)).toBe('M4 4L6 6M6 4L4 6');
    expect(halfShape(5, 5, 2)).toBe('M5 3a2 2 0 0 0 0 4z');
  });
});
