import { describe, expect, it } from 'vitest';
import { durationText, fromLocalInput, toLocalInput } from './time';

describe('operations times', () => {
  it('turns a typed local time into ISO 8601 with the local offset and back', () => {
    const iso = fromLocalInput('2027-03-01 08:30')!;
    expect(iso).toMatch(/^2027-03-01T08:30:00[+-]\d{2}:\d{2}$/);
    expect(toLocalInput(new Date(iso))).toBe('2027-03-01 08:30');
  });
  it('refuses what is not a time', () => {
    expect(fromLocalInput('tomorrow')).toBeNull();
    expect(fromLocalInput('2027-02-30 08:00')).toBeNull();
  });
  it('writes durations plainly', () => {
    expect([durationText(45), durationText(90), durationText(60 * 50)]).toEqual(['45 min', '1 h 30 min', '2 days 2 h']);
  });
});
