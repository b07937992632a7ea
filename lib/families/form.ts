// Reading a family's own form fields (named <prefix><name>) into storage units, and writing stored
// values back in the reader's units. Shared by the finish form and the tank settings form. Pure.
import { displayUnit, fromStorage, toStorage, type UnitOf, type UnitSystem } from '@/lib/plating';
import type { FamilyFormField } from './types';

export type FormUnits = { thickness: UnitOf<'thickness'>; temperature: UnitOf<'temperature'> };

/** Raw form values to the family's storage units; an empty optional field is left out. */
export function readFamilyFields(fields: readonly FamilyFormField[], form: Record<string, unknown>, prefix: string, units: FormUnits): Record<string, unknown> {
  const raw: Record<string, unknown> = {};
  for (const f of fields) {
    const value = form[`${prefix}${f.name}`];
    const text = typeof value === 'string' ? value.trim().replace(',', '.').replace(/^\$/, '') : '';
    if (text === '') {
      if (!f.optional) raw[f.name] = undefined;
      continue;
    }
    if (f.kind === 'select') {
      raw[f.name] = text;
      continue;
    }
    const n = Number(text);
    if (!Number.isFinite(n)) raw[f.name] = text;
    else if (f.convert === 'thicknessPerHour') raw[f.name] = toStorage(n, units.thickness);
    else if (f.convert === 'temperature') raw[f.name] = toStorage(n, units.temperature);
    else if (f.convert === 'dollars') raw[f.name] = Math.round(n * 100);
    else raw[f.name] = n;
  }
  return raw;
}

/** Stored values as the form shows them, in the reader's units. */
export function familyFieldText(f: FamilyFormField, value: unknown, system: UnitSystem): string {
  if (typeof value === 'string') return value;
  if (typeof value !== 'number' || !Number.isFinite(value)) return '';
  const shown =
    f.convert === 'thicknessPerHour'
      ? fromStorage(value, displayUnit('thickness', system))
      : f.convert === 'temperature'
        ? fromStorage(value, displayUnit('temperature', system))
        : f.convert === 'dollars'
          ? value / 100
          : value;
  return String(Number(shown.toPrecision(6)));
}
