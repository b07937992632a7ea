// The finish form's starting values, shown in the user's units. Pure.
import { centsToDollarText, plainNumber } from '@/lib/records/fields';
import { DISTRIBUTION_RATIO_DEFAULTS, displayUnit, fromStorage, type UnitSystem } from '@/lib/plating';
import type { ProcessFamilyId } from '@/db/types';
import { FAMILIES } from '@/lib/families';
import { familyFieldText } from '@/lib/families/form';
import { routeToText, type RouteStep } from './hazards';

type Saved = {
  id: string;
  code: string;
  name: string;
  spec_text: string;
  process_route: RouteStep[];
  element: string;
  ion_charge: number;
  min_thickness_um: number;
  max_thickness_um: number | null;
  method: 'rack' | 'barrel';
  current_density_adm2: number | null;
  efficiency: number | null;
  distribution_ratio: number;
  tank_volts: number;
  parts_per_load: number;
  handling_minutes_per_load: number;
  masking_per_piece_cents: number;
  bake_required: boolean;
  bake_threshold_hrc: number | null;
  bake_window_hours: number;
  bake_temp_c: number | null;
  bake_hours: number | null;
  line_id: string | null;
  is_active: boolean;
  family: ProcessFamilyId;
  family_params: Record<string, unknown>;
};

/** Each family's own fields as fp_<name>, in the user's units; other families' fields keep their defaults. */
function familyFieldDefaults(family: ProcessFamilyId, params: Record<string, unknown>, system: UnitSystem): Record<string, string> {
  const out: Record<string, string> = {};
  for (const fam of [...FAMILIES.filter((f) => f.id !== family), ...FAMILIES.filter((f) => f.id === family)]) {
    const defaults = fam.defaultParams as Record<string, unknown>;
    const values = fam.id === family ? { ...defaults, ...params } : defaults;
    for (const f of fam.form) out[`fp_${f.name}`] = familyFieldText(f, values[f.name], system);
  }
  return out;
}

export function finishFormDefaults(f: Saved | null, system: UnitSystem): Record<string, string> {
  const thicknessUnit = displayUnit('thickness', system);
  const cdUnit = displayUnit('currentDensity', system);
  const tempUnit = displayUnit('temperature', system);
  if (!f) {
    return {
      finishId: '', code: '', name: '', specText: '', route: '', metal: 'Zn2+', minThickness: '', maxThickness: '', thicknessUnit,
      method: 'rack', currentDensity: '', currentDensityUnit: cdUnit, efficiencyPercent: '', distributionRatio: String(DISTRIBUTION_RATIO_DEFAULTS.rack),
      tankVolts: '6', partsPerLoad: '', handlingMinutesPerLoad: '10', maskingPerPiece: '0.00', bakeRequired: '', bakeThresholdHrc: '31',
      bakeWindowHours: '4', bakeTemp: '', temperatureUnit: tempUnit, bakeHours: '', lineId: '', isActive: 'on', family: 'electroplating',
      ...familyFieldDefaults('electroplating', {}, system),
    };
  }
  return {
    finishId: f.id,
    code: f.code,
    name: f.name,
    specText: f.spec_text,
    route: routeToText(f.process_route),
    metal: `${f.element}${f.ion_charge}+`,
    minThickness: plainNumber(fromStorage(f.min_thickness_um, thicknessUnit)),
    maxThickness: f.max_thickness_um === null ? '' : plainNumber(fromStorage(f.max_thickness_um, thicknessUnit)),
    thicknessUnit,
    method: f.method,
    currentDensity: f.current_density_adm2 === null ? '' : plainNumber(fromStorage(f.current_density_adm2, cdUnit)),
    currentDensityUnit: cdUnit,
    efficiencyPercent: f.efficiency === null ? '' : plainNumber(f.efficiency * 100),
    distributionRatio: plainNumber(f.distribution_ratio),
    tankVolts: plainNumber(f.tank_volts),
    partsPerLoad: String(f.parts_per_load),
    handlingMinutesPerLoad: plainNumber(f.handling_minutes_per_load),
    maskingPerPiece: centsToDollarText(f.masking_per_piece_cents),
    bakeRequired: f.bake_required ? 'on' : '',
    bakeThresholdHrc: plainNumber(f.bake_threshold_hrc),
    bakeWindowHours: plainNumber(f.bake_window_hours),
    bakeTemp: f.bake_temp_c === null ? '' : plainNumber(fromStorage(f.bake_temp_c, tempUnit)),
    temperatureUnit: tempUnit,
    bakeHours: plainNumber(f.bake_hours),
    lineId: f.line_id ?? '',
    isActive: f.is_active ? 'on' : '',
    family: f.family,
    ...familyFieldDefaults(f.family, f.family_params, system),
  };
}
