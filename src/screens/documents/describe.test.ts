import { describe, expect, it } from 'vitest';
import { sizeText, typeText } from './describe';

describe('document words', () => {
  it('gives sizes with units and separators', () => {
    expect(sizeText(512)).toBe('512 B');
    expect(sizeText(2048)).toBe('2 kB');
    expect(sizeText(900_000)).toBe('878.9 kB');
    expect(sizeText(1_500_000)).toBe('1.4 MB');
    expect(sizeText(25 * 1024 * 1024)).toBe('25 MB');
  });
  it('names types in words', () => {
    expect(typeText('application/pdf')).toBe('PDF');
    expect(typeText('text/csv')).toBe('CSV table');
  });
});
