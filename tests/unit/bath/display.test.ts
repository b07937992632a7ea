import { describe, expect, it } from 'vitest';
import { canConvert, convertSymbol, displayUnitOf, formatWhen, toDisplay, verdictSentence } from '@/lib/bath/display';

describe('bath display units', () => {
  it('shows g/L as oz/gal and °C as °F to a US reader, and leaves other units alone', () => {
    // Source: NIST Handbook 44 App. C — 1 oz/gal = 28.349523125 g ÷ 3.785411784 L = 7.48915 g/L.
    expect(toDisplay(7.48915, 'g/L', 'us').value).toBeCloseTo(1, 5);
    expect(toDisplay(100, '°C', 'us')).toEqual({ value: 212, unit: '°F' });
    expect(toDisplay(4.9, 'pH', 'us')).toEqual({ value: 4.9, unit: 'pH' });
    expect(displayUnitOf('mL/L', 'us')).toBe('mL/L');
    expect(displayUnitOf('oz/gal', 'metric')).toBe('g/L');
  });

  it('converts only between units of one quantity', () => {
    expect(canConvert('°F', '°C')).toBe(true);
    expect(canConvert('oz/gal', '°C')).toBe(false);
    expect(canConvert('mL/L', 'mL/L')).toBe(true);
    expect(() => convertSymbol(1, 'mL/L', 'g/L')).toThrow(/Cannot convert/);
  });

  it('says which limit was crossed, in the reader units', () => {
    const limits = { target: 50, lowerControl: 40, upperControl: 60 };
    expect(verdictSentence({ status: 'out_of_range', limit: 'lower_control' }, limits, '°C', 'us')).toBe('Below the lower control limit (104 °F).');
    expect(verdictSentence({ status: 'near_limit', limit: 'upper_control' }, limits, 'g/L', 'metric')).toBe('Close to the upper control limit (60 g/L).');
    expect(verdictSentence({ status: 'in_range', limit: null }, limits, 'g/L', 'metric')).toBe('Within the limits.');
  });

  it('formats times the same on server and browser', () => {
    // The shop's zone (the demo shop's America/New_York: EST is UTC−5 in November, IANA tz database).
    expect(formatWhen('2026-11-30T07:05:00Z')).toBe('30 Nov 2026, 02:05 EST');
    expect(formatWhen('not a date')).toBe('—');
  });
});
