import { describe, expect, it } from 'vitest';
import { evaluateReading, evaluateValue, type EvaluateAnalyte } from '@/lib/bath/evaluate';
import { getTemplate } from '@/lib/bath/templates';
import { supplyFor } from '@/lib/bath/templates/supplies';

function fromTemplate(templateId: string, key: string): EvaluateAnalyte {
  const a = getTemplate(templateId)!.analytes.find((x) => x.key === key)!;
  return {
    key: a.key,
    name: a.name,
    unit: a.unit,
    methodId: a.methodId,
    limits: { target: a.target, lowerControl: a.lowerControl, upperControl: a.upperControl, lowerSpec: a.lowerSpec, upperSpec: a.upperSpec },
    supply: supplyFor(templateId, key),
  };
}

describe('evaluateReading', () => {
  const nickel = fromTemplate('watts-nickel', 'nickel');

  it('titration: 15.00 mL of 0.1 M EDTA on 2 mL is 44.0 g/L Ni, out of range low, with a nickel sulfate addition', () => {
    // Source: complexometric nickel by EDTA, 1:1 — g/L = mL × 0.1 mol/L × 58.693 g/mol ÷ 2 mL = mL × 2.935 (IUPAC Ni 58.693).
    const r = evaluateReading(nickel, 2000, { buretteMl: 15 });
    if (!r.ok) throw new Error(r.message);
    expect(r.value).toBeCloseTo(15 * 2.93465, 3);
    expect(r.verdict.status).toBe('out_of_range');
    expect(r.verdict.limit).toBe('lower_control');
    expect(r.recommendation).toMatchObject({ kind: 'add', unit: 'kg', material: 'Nickel sulfate hexahydrate' });
  });

  it('a °F reading is stored in the method unit (°C)', () => {
    // Source: NIST SP 811 — t/°C = (t/°F − 32)/1.8: 131 °F = 55 °C.
    const r = evaluateReading(fromTemplate('watts-nickel', 'temperature'), 2000, { reading: 131 }, '°F');
    expect(r).toMatchObject({ ok: true, unit: '°C', verdict: { status: 'in_range' } });
    if (r.ok) expect(r.value).toBeCloseTo(55, 9);
  });

  it('names the field when the input is unusable', () => {
    expect(evaluateReading(nickel, 2000, {})).toMatchObject({ ok: false, field: 'buretteMl' });
    expect(evaluateReading(nickel, 2000, { buretteMl: -1 })).toMatchObject({ ok: false, field: 'buretteMl' });
    expect(evaluateReading({ ...nickel, methodId: 'nope' }, 2000, { buretteMl: 1 })).toMatchObject({ ok: false, field: 'method' });
    expect(evaluateReading(fromTemplate('watts-nickel', 'ph'), 2000, { reading: 4.5 }, 'oz/gal')).toMatchObject({ ok: false, field: 'reading' });
  });

  it('an outside lab value is judged as given', () => {
    const r = evaluateValue(nickel, 2000, 110);
    expect(r).toMatchObject({ ok: true, verdict: { status: 'out_of_range', limit: 'upper_control' }, recommendation: { kind: 'decant' } });
    expect(evaluateValue(nickel, 2000, Number.NaN)).toMatchObject({ ok: false });
  });
});
