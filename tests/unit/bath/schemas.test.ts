import { describe, expect, it } from 'vitest';
import { floorEntrySchema, limitsSchema } from '@/lib/bath/schemas';

const ids = { tankId: '7d7a0b8e-2f5e-4c1e-9a56-0f1b1f7c8a11', analyteId: '2b0e7e2e-6e0a-4a39-8b1e-3c2d9d3f1a22' };

describe('floor entry schema', () => {
  it('accepts an analysis, an addition and a meter reading', () => {
    const now = new Date().toISOString();
    expect(floorEntrySchema.parse({ kind: 'analysis', key: 'floor-abcdef12', ...ids, inputs: { buretteMl: 15 }, takenAt: now }).kind).toBe('analysis');
    expect(floorEntrySchema.parse({ kind: 'addition', key: 'floor-abcdef13', tankId: ids.tankId, material: 'Boric acid', amount: 2, unit: 'kg', madeAt: now }).kind).toBe('addition');
    expect(floorEntrySchema.parse({ kind: 'meter', key: 'floor-abcdef14', tankId: ids.tankId, ampHours: 12, readAt: now }).kind).toBe('meter');
  });

  it('refuses future times, old entries (except corrections), unknown inputs and bad amounts', () => {
    const future = new Date(Date.now() + 3600_000).toISOString();
    const old = new Date(Date.now() - 40 * 86_400_000).toISOString();
    const base = { kind: 'analysis', key: 'floor-abcdef12', ...ids, inputs: { buretteMl: 15 } };
    expect(floorEntrySchema.safeParse({ ...base, takenAt: future }).success).toBe(false);
    expect(floorEntrySchema.safeParse({ ...base, takenAt: old }).success).toBe(false);
    expect(floorEntrySchema.safeParse({ ...base, takenAt: old, supersedesId: ids.analyteId }).success).toBe(true);
    expect(floorEntrySchema.safeParse({ ...base, inputs: { burette: 15 }, takenAt: new Date().toISOString() }).success).toBe(false);
    const addition = { kind: 'addition', key: 'floor-abcdef13', tankId: ids.tankId, material: 'X', unit: 'kg', madeAt: new Date().toISOString() };
    expect(floorEntrySchema.safeParse({ ...addition, amount: 0 }).success).toBe(false);
    expect(floorEntrySchema.safeParse({ ...addition, amount: Number.POSITIVE_INFINITY }).success).toBe(false);
    expect(floorEntrySchema.safeParse({ ...addition, amount: 1, key: 'short' }).success).toBe(false);
  });
});

describe('limits form schema', () => {
  it('reads empty boxes as no limit and refuses text that is not a number', () => {
    const ok = limitsSchema.parse({ analyteId: ids.analyteId, target: '76.2', lowerControl: '48.3', upperControl: '', frequencyHours: '24', reason: 'New data sheet' });
    expect(ok).toMatchObject({ target: 76.2, lowerControl: 48.3, upperControl: null, lowerSpec: null });
    const bad = limitsSchema.safeParse({ analyteId: ids.analyteId, target: '7,5', frequencyHours: '0', reason: 'x' });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues.map((i) => i.path[0]).sort()).toEqual(['frequencyHours', 'reason', 'target']);
  });
});
