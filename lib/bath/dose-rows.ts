// Additive doses as the floor shows them: the material's name from the analyte's supply.
import type { AdditiveDue } from './amp-hours';
import { supplyMaterial, type AnalyteSupply } from './templates/supplies';

export type DoseRow = { analyteId: string; name: string; material: string; rateMlPerKAh: number; kiloAmpHours: number; doseL: number; complete: boolean };

export function doseRows(doses: readonly AdditiveDue[], analytes: readonly { id: string; supply: AnalyteSupply | null }[]): DoseRow[] {
  return doses.map((d) => {
    const supply = analytes.find((a) => a.id === d.analyteId)?.supply ?? null;
    return {
      analyteId: d.analyteId,
      name: d.name,
      material: supply ? supplyMaterial(supply) : d.name,
      rateMlPerKAh: d.rateMlPerKAh,
      kiloAmpHours: d.kiloAmpHours,
      doseL: d.doseL,
      complete: d.complete,
    };
  });
}
