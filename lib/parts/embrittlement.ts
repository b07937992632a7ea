// Which parts may need a hydrogen-embrittlement relief bake after plating. Pure.
// Source: ASTM B849 scope (steels of 1000 MPa and above) and ASTM B850 Table 1, whose first band
// starts at 31 HRC (reference §7; constants shared with lib/quality/bake.ts).
import { B850_BANDS, DEFAULT_THRESHOLD_MPA } from '@/lib/quality/bake';

export const BAKE_HRC_THRESHOLD = B850_BANDS[0]!.hrcFrom;
export const BAKE_MPA_THRESHOLD = DEFAULT_THRESHOLD_MPA;

export function mayNeedReliefBake(part: { hardnessHrc: number | null; tensileMpa: number | null }): boolean {
  return (part.hardnessHrc !== null && part.hardnessHrc >= BAKE_HRC_THRESHOLD) || (part.tensileMpa !== null && part.tensileMpa >= BAKE_MPA_THRESHOLD);
}

// Shown beneath the standard high-strength-steel caution text.
export const RELIEF_BAKE_CAUTION =
  `This part is at or above ${BAKE_HRC_THRESHOLD} HRC or ${BAKE_MPA_THRESHOLD} MPa, so it may need a hydrogen-embrittlement relief bake ` +
  "after plating (ASTM B850 / B849). The customer's specification governs the bake.";
