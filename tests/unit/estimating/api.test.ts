import { describe, expect, it } from 'vitest';
import { AppError } from '@/lib/errors';
import { estimateFromRequest, type EstimateRequest } from '@/lib/estimating/api';
import { US_NICKEL_REQUEST, usNickelByHand } from './us-nickel-request';

const nickel = (patch: Partial<EstimateRequest> = {}): EstimateRequest => ({
  area: { value: 1, unit: 'dm2' },
  thickness: { value: 2, unit: 'um' },
  currentDensity: { value: 1, unit: 'A/dm2' },
  element: 'Ni',
  charge: 2,
  efficiency: 0.95,
  distributionRatio: 1,
  ...patch,
});

function refusal(body: unknown): { message: string; fields: Record<string, string[]> } {
  try {
    estimateFromRequest(body, 'metric');
  } catch (e) {
    if (!(e instanceof AppError)) throw e;
    expect(e.code).toBe('BAD_INPUT');
    return { message: e.message, fields: e.fieldErrors ?? {} };
  }
  throw new Error('expected a refusal');
}

describe('estimateFromRequest: published examples', () => {
  it('reproduces the nickel chart at 95 % efficiency: 2 µm takes 0.17 A·h/dm², about 10 min at 1 A/dm², 0.18 g/dm²', () => {
    // Source: S. Rudy, nickel thickness chart (reference §1.4, E5), stated to two significant figures.
    const r = estimateFromRequest(nickel(), 'metric');
    expect(Number(r.results.ampHoursLot!.value.toPrecision(2))).toBe(0.17);
    expect(Math.round(r.results.minutesPerLoad!.value)).toBe(10);
    expect(Number(r.results.depositMassPerPart!.value.toPrecision(2))).toBe(0.18);
    expect(r.results.ampHoursLot!.unit).toBe('A·h');
  });

  it('reproduces the 9.84 µm nickel problem: 40 A/m² for 2 h, entered as 4 mA/cm²', () => {
    // Source: physics problem S13 (reference §1.4, E2): J = 40 A/m², t = 2 h → 9.84 µm at 100 % efficiency.
    const r = estimateFromRequest(nickel({ currentDensity: { value: 4, unit: 'mA/cm2' }, thickness: { value: 9.84, unit: 'um' }, efficiency: 1 }), 'metric');
    expect(Number((r.results.minutesPerLoad!.value / 60).toPrecision(3))).toBe(2);
  });
});

describe('estimateFromRequest: units in and out', () => {
  const body = US_NICKEL_REQUEST as unknown as EstimateRequest;
  const r = estimateFromRequest(body, 'us');

  it('gives the same figures as the engine fed storage units', () => {
    const e = usNickelByHand();
    expect(r.results.ampHoursLot!.value).toBeCloseTo(e.nominal.ampHoursLot, 9);
    expect(r.results.minutesPerLoad!.value).toBeCloseTo(e.nominal.minutesPerLoad, 9);
    expect(r.results.loads).toEqual({ value: e.loads, unit: 'loads' });
    expect(r.results.areaPerLot).toEqual({ value: expect.closeTo(500 * 12.5 * 0.064516, 9), unit: 'dm2' });
    expect(r.lowerEfficiency!.efficiency).toBe(0.9);
    expect(r.lowerEfficiency!.results.ampHoursLot!.value).toBeCloseTo(e.lowerEfficiency!.ampHoursLot, 9);
  });

  it('answers in the requested system: ft², mil, lb', () => {
    expect(r.system).toBe('us');
    // Source: NIST SP 811 App. B.8: 1 ft² = 144 in²; 1 lb = 453.59237 g.
    expect(r.display.areaPerLot).toEqual({ value: expect.closeTo((500 * 12.5) / 144, 9), unit: 'ft2' });
    expect(r.display.minimumThickness).toEqual({ value: expect.closeTo(0.3, 12), unit: 'mil' });
    expect(r.display.metalDeposited!.unit).toBe('lb');
    expect(r.display.metalDeposited!.value).toBeCloseTo(r.results.metalDeposited!.value / 453.59237, 12);
    expect(estimateFromRequest({ ...body, system: 'metric' }, 'us').display.minimumThickness).toEqual({ value: expect.closeTo(7.62, 12), unit: 'um' });
    expect(r.assumptions).toMatchObject({ rectifierMaxA: 500, tankVolts: 6, rectifierEfficiency: 0.85, distributionRatioIsDefault: true });
  });
});

describe('estimateFromRequest: bad input names the field and the reason', () => {
  it.each([
    ['no area', { ...nickel(), area: undefined }, 'area', /^Required: \{ "value": a number, "unit": one of dm2, cm2, m2, in2, ft2 \}\.$/],
    ['an unknown unit', nickel({ area: { value: 1, unit: 'acre' as 'dm2' } }), 'area.unit', /Invalid option/],
    ['a negative area', nickel({ area: { value: -1, unit: 'dm2' } }), 'area.value', /greater than 0/],
    ['a string for a number', nickel({ efficiency: '0.9' as unknown as number }), 'efficiency', /Expected a finite number, got text/],
    ['a percentage for a fraction', nickel({ efficiency: 95 }), 'efficiency', /Enter a fraction: 95 % is 0.95/],
    ['an unknown element', nickel({ element: 'Xx' }), 'element', /Invalid option/],
    ['a charge the metal has no bath for', nickel({ charge: 3 }), 'charge', /No plating data for element "Ni" with charge 3/],
    ['a misspelt key', { ...nickel(), efficency: 0.9 }, 'efficency', /Unrecognized key/],
    ['a fractional quantity', nickel({ quantity: 2.5 }), 'quantity', /Expected a whole number, got 2.5/],
    ['a vanishing distribution ratio', nickel({ distributionRatio: 5e-324 }), 'distributionRatio', /average thickness too large/],
    ['a rectifier too small', nickel({ area: { value: 10, unit: 'dm2' }, currentDensity: { value: 5, unit: 'A/dm2' }, rectifierMaxA: 20 }), 'rectifierMaxA', /more than the rectifier's 20 A/],
    ['an unreadable salt', nickel({ anodes: 'insoluble', replenishmentSalt: 'Ni((' }), 'replenishmentSalt', /Cannot read the formula/],
    ['an area that overflows when converted', nickel({ area: { value: 1e308, unit: 'ft2' } }), 'area.value', /1e\+308 ft2 is too large to convert to dm2/],
    ['a lot too large to represent', nickel({ area: { value: 1e300, unit: 'dm2' }, quantity: 1e9 }), 'area.value', /outside the range this calculation can represent/],
    ['not an object', [1, 2], 'body', /expected object/],
  ])('%s', (_name, body, field, reason) => {
    const { fields, message } = refusal(body);
    expect(Object.keys(fields)).toContain(field);
    expect(fields[field]!.join(' ')).toMatch(reason);
    expect(message).not.toMatch(/NaN|Infinity/);
  });
});
