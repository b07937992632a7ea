// Whether a part on a finish needs an embrittlement-relief bake: the finish says so, or the steel
// is hard or strong enough. Pure; shared by pricing (bake charge) and work orders (bake step).
import { B850_BANDS, DEFAULT_THRESHOLD_MPA } from '@/lib/quality/bake';

// Relief applies from about 31 HRC / 1000 MPa (Source: ASTM B849 scope; B850 Table 1 first band).
export const DEFAULT_BAKE_THRESHOLD_HRC = B850_BANDS[0]!.hrcFrom;

export type BakeRuleInput = {
  finishRequiresBake: boolean;
  /** The finish's own hardness threshold; the B849 default applies when it has none. */
  finishThresholdHrc: number | null;
  hardnessHrc: number | null;
  tensileMpa: number | null;
};

export type BakeDecision = { applies: boolean; reason: string | null };

export function bakeDecision(input: BakeRuleInput): BakeDecision {
  if (input.finishRequiresBake) return { applies: true, reason: 'The finish specification requires a relief bake.' };
  const thresholdHrc = input.finishThresholdHrc ?? DEFAULT_BAKE_THRESHOLD_HRC;
  if (input.hardnessHrc !== null && input.hardnessHrc >= thresholdHrc) {
    return { applies: true, reason: `The part is ${input.hardnessHrc} HRC, at or above the ${thresholdHrc} HRC bake threshold.` };
  }
  if (input.tensileMpa !== null && input.tensileMpa >= DEFAULT_THRESHOLD_MPA) {
    return { applies: true, reason: `The part's tensile strength is ${input.tensileMpa} MPa, at or above ${DEFAULT_THRESHOLD_MPA} MPa.` };
  }
  return { applies: false, reason: null };
}
