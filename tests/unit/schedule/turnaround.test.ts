// How the order pages word an order's place on the line's plan and a quote's turnaround.
import { describe, expect, it } from 'vitest';
import type { WorkOrderState } from '@/db/types';
import { plannedText, turnaroundText } from '@/lib/schedule/turnaround';

const day = (d: string | null) => `<${d}>`;

describe('plannedText', () => {
  it('writes one day when the order starts and finishes on the same day, else the range', () => {
    expect(plannedText({ start: '2027-02-03', finish: '2027-02-03' }, 'received', day)).toBe('<2027-02-03>');
    expect(plannedText({ start: '2027-02-03', finish: '2027-02-05' }, 'in_process', day)).toBe('<2027-02-03> to <2027-02-05>');
  });

  it('says "Not planned yet" for an order still to run and "Done" for one past the line', () => {
    for (const state of ['accepted', 'received', 'in_process'] as WorkOrderState[]) expect(plannedText(undefined, state, day)).toBe('Not planned yet');
    for (const state of ['plated', 'baked', 'inspected', 'shipped', 'invoiced'] as WorkOrderState[]) expect(plannedText(undefined, state, day)).toBe('Done');
    // A plan entry with no finish (no tank runs the finish) is not a date.
    expect(plannedText({ start: null, finish: null }, 'received', day)).toBe('Not planned yet');
  });
});

describe('turnaroundText', () => {
  it('counts working days, singular for one, nothing without a figure', () => {
    expect(turnaroundText(1)).toMatch(/^Turnaround 1 working day from/);
    expect(turnaroundText(6)).toMatch(/^Turnaround 6 working days from/);
    expect(turnaroundText(null)).toBeNull();
  });
});
