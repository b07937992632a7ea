import { describe, expect, it } from 'vitest';
import { countdownStatus, describeRemaining } from '@/components/countdown/countdown';

describe('countdown text and status', () => {
  it.each([
    [2 * 3_600_000 + 5 * 60_000, '2 h 05 min left', 'ok'],
    [59 * 60_000 + 59_000, '59 min left', 'near'],
    [30_000, 'less than a minute left', 'near'],
    [-12 * 60_000, 'closed 12 min ago', 'out'],
    [-(3 * 3_600_000 + 60_000), 'closed 3 h 01 min ago', 'out'],
  ])('%i ms → %s (%s)', (ms, text, status) => {
    expect(describeRemaining(ms).text).toBe(text);
    expect(countdownStatus(ms, 60)).toBe(status);
  });

  it('never prints NaN', () => {
    expect(describeRemaining(Number.NaN)).toEqual({ text: '—', closed: false });
    expect(countdownStatus(Number.NaN, 60)).toBe('none');
  });
});
