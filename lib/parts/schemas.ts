// Form and import input for parts; shared by the server action, the CSV import and tests.
import { z } from 'zod';
import { CORROSIVITY_CATEGORIES, SUBSTRATES, unitsOf, type UnitOf } from '@/lib/plating';
import { numberField, optionalNumberField, optionalText, requiredText, uuidField } from '@/lib/records/fields';
import { isShapeKind, measureShapeEntry, SHAPES, shapeField, type LengthUnit, type ShapeEntry } from './shapes';

const substrateIds = Object.keys(SUBSTRATES) as [keyof typeof SUBSTRATES, ...(keyof typeof SUBSTRATES)[]];
export const AREA_UNITS = unitsOf('area');
// Troy ounces are for precious metal, not for weighing parts.
export const MASS_UNITS = unitsOf('mass').filter((u) => u !== 'ozt') as UnitOf<'mass'>[];

const optionalId = (what: string) => z.preprocess((v) => (v === '' || v === undefined ? null : v), uuidField(what).nullable());

// Fields shared by the form and the CSV import.
export const partFields = {
  partNumber: requiredText('the part number', 80),
  revision: optionalText(20),
  description: optionalText(500),
  substrate: z.enum(substrateIds, { error: 'Choose the substrate material.' }),
  tensileMpa: optionalNumberField('the tensile strength', { positive: true, max: 4999 }),
  hardnessHrc: optionalNumberField('the hardness', { positive: true, max: 79 }),
  weight: optionalNumberField('the weight', { positive: true }),
  weightUnit: z.enum(MASS_UNITS as [UnitOf<'mass'>, ...UnitOf<'mass'>[]], { error: 'Choose a unit of weight.' }).default('g'),
  // Where the customer says the part will serve (ISO 9223), and the life they ask of the coating.
  corrosivityCategory: z.preprocess((v) => (v === '' || v === undefined ? null : v), z.enum(CORROSIVITY_CATEGORIES, { error: 'Choose an ISO 9223 category.' }).nullable()).default(null),
  designLifeYears: optionalNumberField('the design life', { positive: true, max: 200 }).default(null),
  // ± on a finished diameter, in the form's thickness unit (µm or mil); stored in µm.
  sizeTolerance: optionalNumberField('the size tolerance', { positive: true, max: 99999 }).default(null),
  sizeToleranceUnit: z.enum(['um', 'mil'], { error: 'Choose µm or mil.' }).default('um'),
};

export type PartArea =
  | { method: 'direct'; value: number; unit: UnitOf<'area'> }
  | { method: 'shape'; entry: ShapeEntry }
  | { method: 'stl'; fileId: string; unit: LengthUnit };

const areaUnit = z.enum(AREA_UNITS as [UnitOf<'area'>, ...UnitOf<'area'>[]], { error: 'Choose a unit of area.' });
const lengthUnit = z.enum(['mm', 'in'], { error: 'Choose mm or in.' });

// The form posts every method's fields; only the chosen method's are read and checked.
const areaSchema = z
  .looseObject({ areaMethod: z.enum(['direct', 'shape', 'stl'], { error: 'Choose how the area is found.' }) })
  .transform((raw, ctx): { areaSource: PartArea } => {
    const r = raw as Record<string, unknown>;
    const str = (k: string) => (typeof r[k] === 'string' ? (r[k] as string) : '');
    if (raw.areaMethod === 'direct') {
      const value = numberField('the area per part', { positive: true }).safeParse(str('area'));
      const unit = areaUnit.safeParse(str('areaUnit'));
      if (!value.success) ctx.addIssue({ code: 'custom', path: ['area'], message: value.error.issues[0]!.message });
      if (!unit.success) ctx.addIssue({ code: 'custom', path: ['areaUnit'], message: unit.error.issues[0]!.message });
      return value.success && unit.success ? { areaSource: { method: 'direct', value: value.data, unit: unit.data } } : z.NEVER;
    }
    if (raw.areaMethod === 'shape') {
      const kind = str('shapeKind');
      const unit = lengthUnit.safeParse(str('lengthUnit'));
      if (!isShapeKind(kind)) {
        ctx.addIssue({ code: 'custom', path: ['shapeKind'], message: 'Choose a shape.' });
        return z.NEVER;
      }
      if (!unit.success) {
        ctx.addIssue({ code: 'custom', path: ['lengthUnit'], message: 'Choose mm or in.' });
        return z.NEVER;
      }
      const dims = Object.fromEntries(SHAPES[kind].dims.map((d) => [d.key, str(shapeField(d.key))]));
      const flags = Object.fromEntries(SHAPES[kind].flags.map((f) => [f.key, str(shapeField(f.key)) === 'on']));
      const entry: ShapeEntry = { kind, unit: unit.data, dims, flags };
      const outcome = measureShapeEntry(entry);
      if (!outcome.ok) {
        for (const [path, messages] of Object.entries(outcome.fieldErrors)) ctx.addIssue({ code: 'custom', path: [path], message: messages[0]! });
        return z.NEVER;
      }
      return { areaSource: { method: 'shape', entry } };
    }
    const fileId = z.uuid().safeParse(str('stlFileId'));
    const unit = lengthUnit.safeParse(str('stlUnit'));
    if (!fileId.success) ctx.addIssue({ code: 'custom', path: ['stlFile'], message: 'Upload the STL model first.' });
    if (!unit.success) ctx.addIssue({ code: 'custom', path: ['stlUnit'], message: 'Choose the unit the model was drawn in.' });
    return fileId.success && unit.success ? { areaSource: { method: 'stl', fileId: fileId.data, unit: unit.data } } : z.NEVER;
  });

// An intersection so the record fields and the area are checked together: every error at once.
export const partSchema = z
  .object({
    partId: optionalId('a part'),
    customerId: uuidField('the customer'),
    drawingFileId: optionalId('a drawing'),
    ...partFields,
  })
  .and(areaSchema)
  .transform(({ areaSource, ...rest }) => ({ ...rest, area: areaSource }));

export type PartInput = z.infer<typeof partSchema>;
