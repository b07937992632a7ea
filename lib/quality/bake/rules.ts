// The relief bake one lot needs: whether (the work order says), how long, how hot and how soon.
// Pure. The finish records the customer's specification, which governs; the ASTM B850 table is
// shown beside it and used only where the finish is silent.
import { bakeDecision } from '@/lib/quotes/bake-rule';
import { BAKE_CAUTION, BAKE_MAX_C, BAKE_MIN_C, DEFAULT_WINDOW_H, bakeRequirement, type BakeRequirement } from '.';

// A set point outside the B850 range is held within ±14 °C, the tolerance a published
// specification uses for its relief bake (Source: QQ-N-290 example, reference §7, 191 ± 14 °C).
export const SET_POINT_TOLERANCE_C = 14;

export type LotBakeInput = {
  orderBakeRequired: boolean;
  part: { tensileMpa: number | null; hardnessHrc: number | null };
  finish: {
    bakeRequired: boolean;
    bakeThresholdHrc: number | null;
    bakeWindowHours: number | null;
    bakeTempC: number | null;
    bakeHours: number | null;
  };
};

export type LotBakeRequirement = BakeRequirement & {
  /** Why the bake applies, in words; null when it does not. */
  reason: string | null;
  /** Hours from the B850 table for the part's strength, when it has one. */
  tableHours: number | null;
  setPointC: number | null;
};

export function lotBakeRequirement(input: LotBakeInput): LotBakeRequirement {
  const { part, finish } = input;
  const decision = bakeDecision({
    finishRequiresBake: finish.bakeRequired,
    finishThresholdHrc: finish.bakeThresholdHrc,
    hardnessHrc: part.hardnessHrc,
    tensileMpa: part.tensileMpa,
  });
  // The work order is the one record of whether this lot bakes (the state machine follows it);
  // when the part's data now says otherwise, the difference is pointed out, not acted on.
  const required = input.orderBakeRequired;
  const windowHours = finish.bakeWindowHours ?? DEFAULT_WINDOW_H;
  const hasStrength = part.tensileMpa !== null || part.hardnessHrc !== null;
  const table = hasStrength
    ? bakeRequirement({ tensileMpa: part.tensileMpa ?? undefined, hardnessHrc: part.hardnessHrc ?? undefined, windowHours })
    : null;
  const tableHours = table?.minHours ?? null;
  const notes = [...(table?.notes ?? [])];

  const minHours = finish.bakeHours ?? tableHours;
  if (required && finish.bakeHours !== null) {
    notes.push(
      `Bake time ${finish.bakeHours} h from the finish specification` +
        (tableHours !== null && tableHours !== finish.bakeHours ? ` (the ASTM B850 table gives ${tableHours} h for this strength).` : '.'),
    );
  }
  if (required && minHours === null) notes.push("Neither the finish nor the B850 table sets a bake time: enter it from the customer's specification.");

  let minTempC = BAKE_MIN_C;
  let maxTempC = BAKE_MAX_C;
  const setPoint = finish.bakeTempC;
  if (setPoint !== null && (setPoint < BAKE_MIN_C || setPoint > BAKE_MAX_C)) {
    minTempC = setPoint - SET_POINT_TOLERANCE_C;
    maxTempC = setPoint + SET_POINT_TOLERANCE_C;
    notes.push(`Set point ${setPoint} °C from the finish specification, held within ±${SET_POINT_TOLERANCE_C} °C.`);
  }
  if (decision.applies && !required) notes.push(`${decision.reason} The work order does not call for a bake: check the order with a supervisor.`);
  const reason = required ? (decision.reason ?? 'The work order requires a relief bake.') : null;
  return { required, minHours: required ? minHours : null, minTempC, maxTempC, windowHours, notes, caution: BAKE_CAUTION, reason, tableHours, setPointC: setPoint };
}
