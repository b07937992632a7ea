import { describe, expect, it } from 'vitest';
import { bathMetalGPerL, DEFAULT_DRAG_OUT_L_PER_M2, processForFinish, type TankFacts } from '@/lib/quotes/process';
import { bakeDecision } from '@/lib/quotes/bake-rule';
import { canRevise, effectiveQuoteStatus, expiryFrom, isEditable, nextRevision, quoteLabel } from '@/lib/quotes/status';
import { formatRate, formatUnitPrice } from '@/lib/quotes/format';
import { componentFigures } from '@/lib/quotes/display';
import type { CostComponent } from '@/lib/quotes/pricing';
import { catchError } from '../plating/catch-error';

describe('quote status rules', () => {
  const sent = new Date('2026-03-01T10:00:00Z');

  it('expires a sent quote after its valid days, not before', () => {
    const expires = expiryFrom(sent, 30);
    expect(expires.toISOString()).toBe('2026-03-31T10:00:00.000Z');
    expect(effectiveQuoteStatus({ status: 'sent', expires_at: expires }, new Date('2026-03-31T09:59:59Z'))).toBe('sent');
    expect(effectiveQuoteStatus({ status: 'sent', expires_at: expires }, new Date('2026-03-31T10:00:00Z'))).toBe('expired');
    // Decided quotes keep their status whatever the date.
    expect(effectiveQuoteStatus({ status: 'accepted', expires_at: expires }, new Date('2027-01-01'))).toBe('accepted');
  });

  it('edits drafts only, revises what the customer saw, and runs out of letters at Z', () => {
    expect([isEditable('draft'), isEditable('sent')]).toEqual([true, false]);
    expect((['sent', 'expired', 'declined', 'accepted', 'superseded', 'draft'] as const).map(canRevise)).toEqual([true, true, true, false, false, false]);
    expect([nextRevision('A'), nextRevision('Y'), nextRevision('Z'), nextRevision('a')]).toEqual(['B', 'Z', null, null]);
    expect([quoteLabel({ number: 'Q2026-0007', revision: 'A' }), quoteLabel({ number: 'Q2026-0007', revision: 'C' })]).toEqual(['Q2026-0007', 'Q2026-0007 rev C']);
  });

  it('writes unit prices with their fractions of a cent', () => {
    expect([formatUnitPrice(186.632), formatUnitPrice(1850), formatUnitPrice(5952.381)]).toEqual(['$1.86632', '$18.50', '$59.52381']);
  });

  it('writes rates to four significant figures with cents always shown', () => {
    // $3.80/kg of nickel is 380 × 0.45359237 = 172.365 ¢/lb (NIST SP 811 App. B.8: 1 lb = 0.45359237 kg).
    expect(componentFigures({ unit: 'kg', quantity: 1, rateCents: 380 } as CostComponent, 'us').rate).toBe('$1.724/lb');
    expect([formatRate(12.345), formatRate(3850), formatRate(550), formatRate(0)]).toEqual(['$0.1235', '$38.50', '$5.50', '$0.00']);
  });
});

describe('bake rule', () => {
  const base = { finishRequiresBake: false, finishThresholdHrc: null, hardnessHrc: null, tensileMpa: null };
  it('bakes when the finish says so or the steel is at or above the threshold', () => {
    expect(bakeDecision({ ...base, finishRequiresBake: true }).applies).toBe(true);
    // Source: ASTM B849 scope / B850 Table 1: relief from about 31 HRC and 1000 MPa.
    expect(bakeDecision({ ...base, hardnessHrc: 31 }).applies).toBe(true);
    expect(bakeDecision({ ...base, hardnessHrc: 30.9 }).applies).toBe(false);
    expect(bakeDecision({ ...base, tensileMpa: 1000 }).applies).toBe(true);
    expect(bakeDecision({ ...base, tensileMpa: 830, hardnessHrc: 25 }).applies).toBe(false);
    expect(bakeDecision({ ...base, finishThresholdHrc: 36, hardnessHrc: 33 }).applies).toBe(false);
  });
});

describe('shop process for pricing', () => {
  const tank = (over: Partial<TankFacts>): TankFacts => ({
    id: 't', code: 'T', lineId: 'L1', templateId: 'watts-nickel', element: 'Ni', ionCharge: 2, efficiency: 0.95, rectifierMaxA: 1000, anodeType: 'soluble', isActive: true, volumeL: 1000, familySettings: {}, ...over,
  });

  it('reads the bath metal from the tank template, converting a salt to its metal', () => {
    expect(bathMetalGPerL('alkaline-zinc', 'Zn')).toBe(7.5);
    // Acid copper holds 221.5 g/L CuSO₄·5H₂O; Cu is 63.546 ÷ 249.685 = 25.45 % of it (IUPAC atomic weights).
    expect(bathMetalGPerL('acid-copper', 'Cu')).toBeCloseTo(221.5 * 0.25451, 1);
    expect(bathMetalGPerL('no-such-template', 'Ni')).toBe(0);
  });

  it('prefers an active tank on the finish’s own line and refuses when none plates the metal', () => {
    const r = processForFinish({ element: 'Ni', ionCharge: 2, method: 'rack', lineId: 'L2' }, [tank({ id: 'a', code: 'A' }), tank({ id: 'b', code: 'B', lineId: 'L2', rectifierMaxA: 400 })]);
    expect([r.tankCode, r.process.rectifierMaxA, r.process.dragOutLPerM2]).toEqual(['B', 400, DEFAULT_DRAG_OUT_L_PER_M2.rack]);
    expect(catchError(() => processForFinish({ element: 'Ni', ionCharge: 2, method: 'rack', lineId: null }, [tank({ isActive: false }), tank({ element: 'Cu' })]))).toMatchObject({ field: 'finish' });
  });
});
