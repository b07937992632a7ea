// Checks shared by every family's run prediction. Pure.
import { wholePositive } from '@/lib/orders/run-math';
import { PlatingInputError } from '@/lib/plating';
import type { FamilyRunInput, FamilyRunPrediction } from './types';

/** Plated area of the run, checked. */
export function runArea(input: FamilyRunInput): number {
  const parts = wholePositive('partsPerLoad', 'Parts per load', input.partsPerLoad, 1_000_000);
  const loads = wholePositive('loads', 'Loads', input.loads, 1000);
  const area = input.areaPerPartDm2;
  if (!(area > 0) || !Number.isFinite(area)) throw new PlatingInputError('areaPerPartDm2', 'Area per part must be a number greater than 0.');
  return loads * parts * area;
}

/** A thickness-making run's verdict: the thinnest significant surface against the minimum. */
export function thicknessVerdict(input: FamilyRunInput, platedAreaDm2: number, averageThicknessUm: number): FamilyRunPrediction {
  const ratio = input.finish.distributionRatio;
  if (!(ratio > 0 && ratio <= 1)) throw new PlatingInputError('distributionRatio', 'The distribution ratio must be greater than 0 and at most 1.');
  const minimumThicknessUm = averageThicknessUm * ratio;
  return {
    platedAreaDm2,
    averageThicknessUm,
    minimumThicknessUm,
    requiredMinimumUm: input.finish.minThicknessUm,
    isBelowMinimum: minimumThicknessUm < input.finish.minThicknessUm,
    outsideWindow: [],
  };
}
