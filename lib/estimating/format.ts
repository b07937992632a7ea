// Text for the workbench's figures: a few significant figures and the unit's symbol, never NaN.
// Pure, shared by the page's client components.
import { displayUnit, formatNumber, fromStorage, type UnitSystem } from '@/lib/plating';
import type { GeometryFigures } from './calculation';
import { LENGTH_UNIT, lengthFromMm, unitSymbol, volumeFromCm3 } from './display-units';
import type { Measure } from './figures';

// U+202F keeps a unit on the line of its number (as components/unit-value.tsx does).
const SPACE = '\u202f';
export const NO_VALUE = '—';

// "0.4600" reads as 0.46: the figures are estimates, so trailing zeros claim too much.
function trimZeros(text: string): string {
  return /^-?\d+\.\d+$/.test(text) ? text.replace(/\.?0+$/, '') : text;
}

export function formatValue(value: number | null | undefined, unit: string, significantFigures = 4): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return NO_VALUE;
  const n = Number.isInteger(value) && Math.abs(value) < 1e15 ? String(value) : trimZeros(formatNumber(value, significantFigures));
  return unit ? `${n}${SPACE}${unitSymbol(unit)}` : n;
}

export function formatMeasure(m: Measure | undefined, significantFigures = 4): string {
  if (!m) return NO_VALUE;
  if (m.unit === 'min' && m.value >= 120) {
    // Long runs read better in hours as well.
    return `${formatValue(m.value, 'min', significantFigures)} (${formatValue(m.value / 60, 'h', 3)})`;
  }
  return formatValue(m.value, m.unit, significantFigures);
}

export type GeometryRow = { label: string; text: string };

export function geometryRows(g: GeometryFigures, system: UnitSystem): GeometryRow[] {
  const area = displayUnit('area', system);
  const areaText = formatValue(fromStorage(g.areaDm2, area), area);
  // A part's area in ft² is a small number; in² beside it is what a drawing shows.
  const rows: GeometryRow[] = [
    { label: 'Area per part', text: system === 'us' ? `${areaText} (${formatValue(fromStorage(g.areaDm2, 'in2'), 'in2')})` : areaText },
  ];
  if (g.boundingBoxMm) {
    const unit = LENGTH_UNIT[system];
    rows.push({ label: 'Bounding box', text: g.boundingBoxMm.map((v) => formatValue(lengthFromMm(v, unit), '')).join(' × ') + `${SPACE}${unit}` });
  }
  if (g.triangleCount !== null) rows.push({ label: 'Triangles', text: g.triangleCount.toLocaleString('en-US') });
  if (g.volumeCm3 !== null) {
    const v = volumeFromCm3(g.volumeCm3, system);
    rows.push({ label: 'Volume', text: formatValue(v.value, v.unit) });
  } else if (g.source !== 'area') {
    rows.push({ label: 'Volume', text: 'not closed: no volume' });
  }
  const mass = displayUnit('mass', system);
  if (g.weightG !== null) rows.push({ label: 'Weight (from the substrate density)', text: formatValue(fromStorage(g.weightG, mass), mass) });
  return rows;
}
