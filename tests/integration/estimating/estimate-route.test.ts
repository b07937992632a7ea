import { afterAll, beforeEach, describe, expect, it, vi } from 'vitest';
import { db } from '@/db';
import { US_NICKEL_REQUEST, usNickelByHand } from '../../unit/estimating/us-nickel-request';
import { postEstimate, signInAs, signOutAll } from './route-session';

vi.mock('next/headers', async () => (await import('./cookie-jar')).nextHeadersStandIn());

afterAll(async () => {
  await signOutAll();
  await db.destroy();
});

const ESTIMATOR = 'estimator@kestrel-plating.test'; // metric, per the demo seed
const BODY = US_NICKEL_REQUEST;

describe('POST /api/v1/plating/estimate: who may call it', () => {
  it('answers 401 to a caller who is not signed in', async () => {
    await signInAs(null);
    const r = await postEstimate(BODY);
    expect(r.status).toBe(401);
    expect(r.json.error.code).toBe('UNAUTHENTICATED');
  });

  it('answers 403 to a customer contact and to a plater', async () => {
    for (const email of ['buyer@northgate-fastener.test', 'plater@kestrel-plating.test']) {
      await signInAs(email);
      const r = await postEstimate(BODY);
      expect(r.status).toBe(403);
      expect(r.json.error.code).toBe('FORBIDDEN');
    }
  });
});

describe('POST /api/v1/plating/estimate: results', () => {
  beforeEach(() => signInAs(ESTIMATOR));

  it('gives the engine’s figures for a US-unit request, in storage units and the caller’s system', async () => {
    const r = await postEstimate(BODY);
    expect(r.status).toBe(200);
    const e = usNickelByHand();
    expect(r.json.results.ampHoursLot.value).toBeCloseTo(e.nominal.ampHoursLot, 9);
    expect(r.json.results.ampHoursLot.unit).toBe('A·h');
    expect(r.json.results.totalTankTime).toEqual({ value: expect.closeTo(e.nominal.totalTankMinutes, 9), unit: 'min' });
    expect(r.json.results.loads).toEqual({ value: 10, unit: 'loads' });
    // The estimator's preference is metric: display matches storage for µm and dm².
    expect(r.json.system).toBe('metric');
    expect(r.json.display.minimumThickness).toEqual({ value: expect.closeTo(7.62, 12), unit: 'um' });
    expect(r.json.lowerEfficiency.efficiency).toBe(0.9);
    expect(r.json.cautions.at(-1)).toMatch(/^Estimates only/);
  });

  it('converts out to US units on request: mil, ft², A·h unchanged', async () => {
    const r = await postEstimate({ ...BODY, system: 'us' });
    expect(r.status).toBe(200);
    expect(r.json.display.minimumThickness).toEqual({ value: expect.closeTo(0.3, 12), unit: 'mil' });
    // Source: NIST SP 811 App. B.8: 1 ft² = 144 in².
    expect(r.json.display.areaPerLot).toEqual({ value: expect.closeTo((500 * 12.5) / 144, 9), unit: 'ft2' });
    expect(r.json.display.ampHoursLot).toEqual(r.json.results.ampHoursLot);
  });

  it.each([
    ['a missing value', { ...BODY, area: undefined }, 'area'],
    ['an unknown unit', { ...BODY, thickness: { value: 1, unit: 'cubit' } }, 'thickness.unit'],
    ['a negative value', { ...BODY, currentDensity: { value: -2, unit: 'A/ft2' } }, 'currentDensity.value'],
    ['text for a number', { ...BODY, quantity: 'five hundred' }, 'quantity'],
    ['a percentage for a fraction', { ...BODY, efficiency: 95 }, 'efficiency'],
    ['an unknown element', { ...BODY, element: 'Unobtainium' }, 'element'],
    ['an ion with no bath', { ...BODY, charge: 5 }, 'charge'],
    ['a misspelt key', { ...BODY, effciency: 0.9 }, 'effciency'],
    ['a rectifier too small for one part', { ...BODY, rectifierMaxA: 0.1 }, 'rectifierMaxA'],
    ['an unreadable salt', { ...BODY, anodes: 'insoluble', replenishmentSalt: '))' }, 'replenishmentSalt'],
    ['a value that overflows its conversion', { ...BODY, area: { value: 1e308, unit: 'ft2' } }, 'area.value'],
    ['an array for a body', [BODY], 'body'],
  ])('refuses %s with 400 naming the field', async (_name, body, field) => {
    const r = await postEstimate(body);
    expect(r.status).toBe(400);
    expect(r.json.error.code).toBe('BAD_INPUT');
    expect(r.json.error.fields[field]?.[0]).toEqual(expect.any(String));
    expect(r.text).not.toMatch(/NaN|Infinity/);
  });

  it('refuses a body that is not JSON with 400', async () => {
    for (const raw of ['{"area": ', 'NaN', '']) {
      const r = await postEstimate(raw);
      expect(r.status).toBe(400);
      expect(r.json.error).toEqual({ code: 'BAD_INPUT', message: 'The request body is not valid JSON.' });
    }
  });
});

describe('POST /api/v1/plating/estimate: a measure that is not an object', () => {
  it('says what a measure looks like, without echoing an infinite number back', async () => {
    await signInAs(ESTIMATOR);
    // 1e999 parses to Infinity: a property run found the message said "received Infinity".
    const r = await postEstimate(`{"area":1e999,"thickness":{"value":0.01,"unit":"um"},"currentDensity":{"value":0.05,"unit":"A/dm2"},"efficiency":0.05,"element":"Ni","charge":2}`);
    expect(r.status).toBe(400);
    expect(r.text).not.toMatch(/NaN|Infinity/);
    expect(r.json.error.fields.area[0]).toMatch(/^Expected \{ "value": a number, "unit": one of .*dm2.* \}, got a number out of range\.$/);
  });
});
