// Hydrogen-embrittlement relief baking: what a part needs and whether a recorded bake met it.
// Pure. All times are instants (Date or epoch ms, UTC), so a window that crosses midnight or a
// daylight-saving change is still the real elapsed time.
//
// Sources: ASTM B850-98 (R2015) Table 1 as reproduced in reference §7 (hours by strength band,
// 190–220 °C); ASTM B849 scope (relief applies from 1000 MPa, about 31 HRC); ASTM F1941 trade
// summary (start within 4 h). The customer's specification always governs, and a bake does not
// guarantee freedom from embrittlement (B850 note).
import { badInput, optionalNumber, requireNumber } from '../../bath/checks';

export const BAKE_MIN_C = 190;
export const BAKE_MAX_C = 220;
/** Start the bake within this many hours of plating end unless the specification says otherwise. */
export const DEFAULT_WINDOW_H = 4;
/** B849 scope: relief baking applies to steels of 1000 MPa and above. */
export const DEFAULT_THRESHOLD_MPA = 1000;

export const BAKE_CAUTION =
  "The customer's specification governs bake temperature, time and start window. A bake reduces but does not rule out hydrogen embrittlement.";

type Band = { maxMpa: number; hrcFrom: number; hrcTo: number; hours: number };

// B850 Table 1: 1001–1100 MPa (31–33 HRC) 8 h … 1701–1800 MPa (49–51 HRC) 22 h. The first band
// starts at the B849 threshold of 1000 MPa; a value between two printed bands goes to the higher one.
export const B850_BANDS: readonly Band[] = [
  { maxMpa: 1100, hrcFrom: 31, hrcTo: 33, hours: 8 },
  { maxMpa: 1200, hrcFrom: 33, hrcTo: 36, hours: 10 },
  { maxMpa: 1300, hrcFrom: 36, hrcTo: 39, hours: 12 },
  { maxMpa: 1400, hrcFrom: 39, hrcTo: 43, hours: 14 },
  { maxMpa: 1500, hrcFrom: 43, hrcTo: 45, hours: 16 },
  { maxMpa: 1600, hrcFrom: 45, hrcTo: 47, hours: 18 },
  { maxMpa: 1700, hrcFrom: 47, hrcTo: 49, hours: 20 },
  { maxMpa: 1800, hrcFrom: 49, hrcTo: 51, hours: 22 },
];

export type BakeRequirement = {
  required: boolean;
  /** null when the table does not cover the part: the customer's specification sets it. */
  minHours: number | null;
  minTempC: number;
  maxTempC: number;
  windowHours: number;
  notes: string[];
  caution: string;
};

function bandIndexForMpa(mpa: number): number {
  if (mpa < DEFAULT_THRESHOLD_MPA) return -1;
  return B850_BANDS.findIndex((b) => mpa <= b.maxMpa); // −1 beyond the table
}

// Hardness equivalents are approximate and the printed bands share their end points; a shared
// value takes the higher (longer) band so the bake is never short.
function bandIndexForHrc(hrc: number): number {
  if (hrc < (B850_BANDS[0] as Band).hrcFrom) return -1;
  if (hrc > (B850_BANDS[B850_BANDS.length - 1] as Band).hrcTo) return B850_BANDS.length;
  let idx = 0;
  B850_BANDS.forEach((b, i) => {
    if (hrc >= b.hrcFrom) idx = i;
  });
  return idx;
}

export function bakeRequirement(input: {
  tensileMpa?: number;
  hardnessHrc?: number;
  specThresholdMpa?: number;
  windowHours?: number;
}): BakeRequirement {
  const tensile = optionalNumber(input.tensileMpa, 'tensileMpa', 'Tensile strength', { positive: true, max: 5000 });
  const hrc = optionalNumber(input.hardnessHrc, 'hardnessHrc', 'Hardness (HRC)', { min: 0, max: 75 });
  const threshold = optionalNumber(input.specThresholdMpa, 'specThresholdMpa', 'Specification threshold', { positive: true });
  const windowHours =
    optionalNumber(input.windowHours, 'windowHours', 'Bake start window', { positive: true, max: 72 }) ?? DEFAULT_WINDOW_H;
  if (tensile === undefined && hrc === undefined) {
    throw badInput('tensileMpa', 'Give the tensile strength or the hardness of the steel.');
  }
  const notes: string[] = [];
  // Band per measure; when both are given the longer bake wins.
  const fromMpa = tensile === undefined ? null : tensile > 1800 ? B850_BANDS.length : bandIndexForMpa(tensile);
  const fromHrc = hrc === undefined ? null : bandIndexForHrc(hrc);
  const idx = Math.max(fromMpa ?? -1, fromHrc ?? -1);
  // Strength used against a customer threshold: the tensile value, or the top of the hardness band.
  const hrcBand = fromHrc !== null && fromHrc >= 0 && fromHrc < B850_BANDS.length ? B850_BANDS[fromHrc] : undefined;
  const strength = tensile ?? (hrcBand ? hrcBand.maxMpa : fromHrc === B850_BANDS.length ? Infinity : undefined);

  let required: boolean;
  if (threshold !== undefined) {
    if (strength === undefined) {
      notes.push('Hardness is below the B850 table: compare a tensile value with the specification threshold.');
      required = false;
    } else {
      required = strength >= threshold;
    }
    notes.push(`Threshold ${threshold} MPa from the customer specification.`);
  } else {
    required = idx >= 0;
  }

  let minHours: number | null = null;
  if (required) {
    if (idx >= 0 && idx < B850_BANDS.length) minHours = (B850_BANDS[idx] as Band).hours;
    else if (idx >= B850_BANDS.length) notes.push('Strength is beyond the ASTM B850 table: the customer specification sets the bake.');
    else notes.push('Strength is below the ASTM B850 table: the customer specification sets the bake time.');
  }
  if ((tensile !== undefined && tensile > 1700) || (hrc !== undefined && hrc > 46)) {
    notes.push('ASTM B633: steel above 1700 MPa (about 46 HRC) is not zinc electroplated unless specified.');
  }
  if (hrc !== undefined) notes.push('Hardness-to-strength equivalents are approximate.');
  return { required, minHours, minTempC: BAKE_MIN_C, maxTempC: BAKE_MAX_C, windowHours, notes, caution: BAKE_CAUTION };
}

const round1 = (x: number): number => Math.round(x * 10) / 10;

function toMs(t: Date | number, field: string, label: string): number {
  const ms = t instanceof Date ? t.getTime() : t;
  return requireNumber(ms, field, label);
}

/** Latest bake start: plating end plus the window, in real elapsed time. */
export function bakeDeadline(platingEnd: Date | number, windowHours: number = DEFAULT_WINDOW_H): Date {
  const end = toMs(platingEnd, 'platingEnd', 'Plating end');
  const h = requireNumber(windowHours, 'windowHours', 'Bake start window', { positive: true, max: 72 });
  return new Date(end + h * 3_600_000);
}

export type BakeReason =
  | { code: 'not_after_plating'; message: string }
  | { code: 'late_start'; minutesLate: number; message: string }
  | { code: 'temperature_low'; degreesC: number; message: string }
  | { code: 'temperature_high'; degreesC: number; message: string }
  | { code: 'duration_short'; hoursShort: number; message: string }
  | { code: 'duration_unknown'; message: string };

export type BakeJudgement = { ok: true; deadline: Date; notes: string[] } | { ok: false; deadline: Date; reasons: BakeReason[] };

export function judgeBake(input: {
  platingEnd: Date | number;
  bakeStart: Date | number;
  /** Part-load temperature: one value, or the lowest and highest logged. */
  tempC: number | { min: number; max: number };
  durationH: number;
  requirement: BakeRequirement;
}): BakeJudgement {
  const end = toMs(input.platingEnd, 'platingEnd', 'Plating end');
  const start = toMs(input.bakeStart, 'bakeStart', 'Bake start');
  const duration = requireNumber(input.durationH, 'durationH', 'Bake duration', { min: 0, max: 500 });
  const t = typeof input.tempC === 'number' ? { min: input.tempC, max: input.tempC } : input.tempC;
  const tMin = requireNumber(t?.min, 'tempC', 'Lowest bake temperature', { min: -50, max: 1000 });
  const tMax = requireNumber(t?.max, 'tempC', 'Highest bake temperature', { min: -50, max: 1000 });
  if (tMin > tMax) throw badInput('tempC', 'The lowest temperature is above the highest.');
  const req = input.requirement;
  const deadline = bakeDeadline(end, req.windowHours);
  if (!req.required) return { ok: true, deadline, notes: ['No relief bake required by the inputs given.'] };

  const reasons: BakeReason[] = [];
  if (start < end) reasons.push({ code: 'not_after_plating', message: 'The bake start is before the plating end.' });
  if (start > deadline.getTime()) {
    const minutesLate = Math.max(1, Math.round((start - deadline.getTime()) / 60_000));
    reasons.push({ code: 'late_start', minutesLate, message: `Bake started ${minutesLate} min after the ${req.windowHours} h window closed.` });
  }
  if (tMin < req.minTempC) {
    const d = round1(req.minTempC - tMin);
    reasons.push({ code: 'temperature_low', degreesC: d, message: `Temperature fell ${d} °C below ${req.minTempC} °C.` });
  }
  if (tMax > req.maxTempC) {
    const d = round1(tMax - req.maxTempC);
    reasons.push({ code: 'temperature_high', degreesC: d, message: `Temperature rose ${d} °C above ${req.maxTempC} °C.` });
  }
  if (req.minHours === null) {
    reasons.push({ code: 'duration_unknown', message: "Enter the bake time from the customer's specification." });
  } else if (duration < req.minHours) {
    const hoursShort = round1(req.minHours - duration);
    reasons.push({ code: 'duration_short', hoursShort, message: `Bake was ${hoursShort} h short of ${req.minHours} h.` });
  }
  return reasons.length === 0 ? { ok: true, deadline, notes: [] } : { ok: false, deadline, reasons };
}
