// Amp-hours from the rectifier's meter, and the additive doses they call for. Pure.
// The meter is a running total that is read now and then and occasionally reset; a reading lower
// than the one before is taken as a reset, and the new reading counts from zero.
import { ampHourAdditionMl } from './additions';
import { badInput, requireNumber } from './checks';

export type MeterPoint = { at: Date; ampHours: number };

export type AmpHoursSince = {
  ampHours: number;
  /** The reading the count starts from (null when there are no readings). */
  from: Date | null;
  to: Date | null;
  resets: number;
  /** False when no reading was taken at or before `since`: the count may be short. */
  complete: boolean;
};

function sorted(readings: readonly MeterPoint[]): MeterPoint[] {
  for (const r of readings) {
    requireNumber(r.ampHours, 'ampHours', 'Meter reading', { min: 0 });
    if (!(r.at instanceof Date) || Number.isNaN(r.at.getTime())) throw badInput('at', 'A meter reading has no valid time.');
  }
  return [...readings].sort((a, b) => a.at.getTime() - b.at.getTime());
}

/** Amp-hours run between `since` (e.g. the last addition) and the latest reading. */
export function ampHoursSince(readings: readonly MeterPoint[], since: Date | null): AmpHoursSince {
  const rs = sorted(readings);
  if (rs.length === 0) return { ampHours: 0, from: null, to: null, resets: 0, complete: false };
  let start = 0;
  let complete = since === null;
  if (since !== null) {
    for (let i = 0; i < rs.length; i++) {
      if ((rs[i] as MeterPoint).at.getTime() <= since.getTime()) {
        start = i;
        complete = true;
      }
    }
  }
  let total = 0;
  let resets = 0;
  for (let i = start + 1; i < rs.length; i++) {
    const prev = (rs[i - 1] as MeterPoint).ampHours;
    const cur = (rs[i] as MeterPoint).ampHours;
    if (cur >= prev) total += cur - prev;
    else {
      resets++;
      total += cur;
    }
  }
  return { ampHours: total, from: (rs[start] as MeterPoint).at, to: (rs[rs.length - 1] as MeterPoint).at, resets, complete };
}

export type AdditiveState = { analyteId: string; name: string; rateMlPerKAh: number; lastAdditionAt: Date | null };

export type AdditiveDue = AdditiveState & { kiloAmpHours: number; doseL: number; complete: boolean; resets: number };

/** kA·h since each additive's last addition and the dose its rate calls for (mL per kA·h → L). */
export function additiveDoses(additives: readonly AdditiveState[], readings: readonly MeterPoint[]): AdditiveDue[] {
  return additives.map((a) => {
    const since = ampHoursSince(readings, a.lastAdditionAt);
    const ml = ampHourAdditionMl({ ampHours: since.ampHours, rateMlPerKAh: a.rateMlPerKAh });
    return { ...a, kiloAmpHours: since.ampHours / 1000, doseL: ml / 1000, complete: since.complete, resets: since.resets };
  });
}
