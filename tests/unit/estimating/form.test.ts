import { describe, expect, it } from 'vitest';
import { calculationInputSchema } from '@/lib/estimating/calculation-schema';
import { readForm } from '@/lib/estimating/form-read';
import { defaultForm, formFromInput, type WorkbenchForm } from '@/lib/estimating/form-state';
import { freeProcessFor } from '@/lib/estimating/process-library';
import { recomputeWorkbench } from '@/lib/estimating/recompute';

const usForm = (patch: Partial<WorkbenchForm> = {}): WorkbenchForm => ({ ...defaultForm('us', []), ...patch });
const metricForm = (patch: Partial<WorkbenchForm> = {}): WorkbenchForm => ({ ...defaultForm('metric', []), ...patch });

function inputOf(form: WorkbenchForm, system: 'metric' | 'us') {
  const r = readForm(form, system);
  expect(r.fieldErrors).toEqual({});
  return r.input!;
}

describe('reading the form in US units', () => {
  const input = inputOf(
    usForm({ minimumThickness: '0.3', currentDensity: '20', bathMetal: '10', dragOut: '1', shape: { kind: 'block', unit: 'in', dims: { lengthMm: '2', widthMm: '1', heightMm: '0.5' }, flags: {} } }),
    'us',
  );

  it('converts mil, A/ft², oz/gal and gal/1000 ft² to storage units with the exact factors', () => {
    // Source: NIST SP 811 App. B.8: 1 in = 25.4 mm exactly, so 0.3 mil = 7.62 µm.
    expect(input.minimumThicknessUm).toBeCloseTo(7.62, 12);
    // Source: NIST SP 811 App. B.8: 1 ft² = 0.09290304 m² = 9.290304 dm², so 20 A/ft² = 2.15278 A/dm².
    expect(input.process.currentDensityAdm2).toBeCloseTo(20 / 9.290304, 12);
    // Source: NIST SP 811 App. B.8 (1 oz = 28.349523125 g, 1 US gal = 3.785411784 L); reference §1.1 rounds it to 7.4892 g/L.
    expect(input.process.bathMetalGPerL).toBeCloseTo(74.892, 3);
    // Source: NIST SP 811 App. B.8: 3.785411784 L per 92.90304 m² (1000 ft²).
    expect(input.process.dragOutLPerM2).toBeCloseTo(3.785411784 / 92.90304, 12);
    expect(input.process.efficiency).toBeCloseTo(freeProcessFor('Ni', 2).efficiency, 12);
  });

  it('measures a 2 × 1 × 0.5 in block as 7 in² = 0.451612 dm²', () => {
    // Area by hand: 2(2·1 + 2·0.5 + 1·0.5) = 7 in²; NIST SP 811: 1 in² = 6.4516 cm².
    const view = recomputeWorkbench(usForm({ shape: { kind: 'block', unit: 'in', dims: { lengthMm: '2', widthMm: '1', heightMm: '0.5' }, flags: {} } }), 'us');
    expect(view.geometry!.areaDm2).toBeCloseTo(0.451612, 12);
    // Volume 1 in³ = 16.387064 cm³ (2.54³); carbon steel at 7.85 g/cm³ (typical handbook value).
    expect(view.geometry!.volumeCm3).toBeCloseTo(16.387064, 9);
    expect(view.geometry!.weightG).toBeCloseTo(16.387064 * 7.85, 9);
  });

  it('shows a stored calculation again in either system and reads it back to six significant figures', () => {
    expect(calculationInputSchema.safeParse(input).success).toBe(true);
    const near = (a: number, b: number) => expect(Math.abs(a - b) / Math.abs(b)).toBeLessThan(5e-6);
    for (const system of ['us', 'metric'] as const) {
      const again = inputOf(formFromInput(input, system), system);
      near(again.minimumThicknessUm, input.minimumThicknessUm);
      near(again.process.currentDensityAdm2, input.process.currentDensityAdm2);
      near(again.process.dragOutLPerM2, input.process.dragOutLPerM2);
      near(again.process.bathMetalGPerL, input.process.bathMetalGPerL);
      expect(again.quantity).toBe(input.quantity);
      expect(again.geometry).toEqual(expect.objectContaining({ kind: 'shape' }));
    }
    // 25 µm in US units is 0.984252 mil (25 / 25.4), not 0.9842519685.
    expect(formFromInput({ ...input, minimumThicknessUm: 25 }, 'us').minimumThickness).toBe('0.984252');
    expect(formFromInput(input, 'metric').minimumThickness).toBe('7.62');
    expect(formFromInput(input, 'metric').shape.dims.lengthMm).toBe('50.8');
  });
});

describe('field messages', () => {
  it('names each missing or impossible value in the user’s words, never NaN', () => {
    const view = recomputeWorkbench(
      metricForm({ quantity: '', efficiencyPct: '120', currentDensity: 'abc', partsPerLoad: '2.5', dragOut: '-1', distributionRatio: '1.4' }),
      'metric',
    );
    expect(view.result).toBeNull();
    expect(view.fieldErrors).toEqual({
      quantity: ['Enter the quantity.'],
      efficiencyPct: ['Cathode efficiency must be more than 0 % and at most 100 %; got 120.'],
      currentDensity: ['Current density must be a number; got "abc".'],
      partsPerLoad: ['Parts per load must be a whole number of at least 1; got 2.5.'],
      dragOut: ['Drag-out cannot be negative; got -1.'],
      distributionRatio: ['Distribution ratio must be more than 0 and at most 1 (minimum ÷ average); got 1.4.'],
    });
    expect(JSON.stringify(view)).not.toMatch(/NaN|Infinity/);
  });

  it('puts engine messages beside the field that caused them', () => {
    expect(recomputeWorkbench(metricForm({ rectifierMaxA: '1' }), 'metric').fieldErrors.rectifierMaxA?.[0]).toMatch(/more than the rectifier's 1 A/);
    expect(recomputeWorkbench(metricForm({ anodes: 'insoluble', replenishmentSalt: 'Xq9' }), 'metric').fieldErrors.replenishmentSalt?.[0]).toMatch(/Cannot read the formula "Xq9"/);
    expect(recomputeWorkbench(metricForm({ anodes: 'insoluble', replenishmentSalt: ' ' }), 'metric').fieldErrors.replenishmentSalt).toEqual(['Enter the salt that replaces the metal, e.g. CrO3.']);
    const tube = recomputeWorkbench(metricForm({ shape: { kind: 'tube', unit: 'mm', dims: { outerDiameterMm: '10', innerDiameterMm: '12', lengthMm: '50' }, flags: {} } }), 'metric');
    expect(tube.fieldErrors.dim_innerDiameterMm?.[0]).toMatch(/must be smaller than the outside diameter/);
    // 1e300 dm² per part cannot make a finite lot area: the area box gets the message.
    const huge = recomputeWorkbench(metricForm({ geometryMode: 'area', area: '1e300', areaUnit: 'dm2', quantity: '1e9', rectifierMaxA: '1e308', currentDensity: '0.001' }), 'metric');
    expect(Object.keys(huge.fieldErrors)).toEqual(['area']);
    const overflow = recomputeWorkbench(usForm({ geometryMode: 'area', area: '1e308', areaUnit: 'ft2' }), 'us');
    expect(overflow.fieldErrors).toEqual({ area: ['1e+308 ft² is too large to work with.'] });
    const tinyRatio = recomputeWorkbench(metricForm({ distributionRatio: '5e-324' }), 'metric');
    expect(tinyRatio.fieldErrors.distributionRatio?.[0]).toMatch(/average thickness too large to work with/);
    expect(JSON.stringify(huge)).not.toMatch(/NaN|Infinity/);
  });

  it('keeps the process cautions up while other fields are wrong', () => {
    const view = recomputeWorkbench(metricForm({ metalKey: 'Ag1+', quantity: '', hardnessHrc: '40' }), 'metric');
    expect(view.result).toBeNull();
    // Source: ASTM B850 Table 1 (39–43 HRC: 14 h), reference §7; silver is plated from cyanide (reference §2).
    expect(view.safety.map((n) => n.kind)).toEqual(['cyanide', 'high-strength-steel-bake']);
    // Every bath: current and hydrogen (reference §12); cyanide is already said above, so not twice;
    // the free silver process is figured from the cyanide silver template, whose free caustic shows.
    expect(view.bathCautions).toEqual(['electrical', 'hydrogen', 'caustic']);
    // Watts nickel (the default): nickel salts, and a heated bath.
    expect(recomputeWorkbench(metricForm(), 'metric').bathCautions).toEqual(['electrical', 'hydrogen', 'nickel', 'heat']);
    // Acid copper sulfate is a strong-acid bath; chromic acid too, with hexavalent chromium said above.
    expect(recomputeWorkbench(metricForm({ metalKey: 'Cu2+' }), 'metric').bathCautions).toContain('acid');
    expect(recomputeWorkbench(metricForm({ metalKey: 'Cr6+' }), 'metric').bathCautions).toEqual(expect.arrayContaining(['acid', 'heat']));
    // Zinc may be acid or alkaline: the bath that runs the finish decides, whatever its name says.
    expect(recomputeWorkbench(metricForm({ metalKey: 'Zn2+' }), 'metric', { words: 'Zinc, clear trivalent passivate', bathHazards: ['caustic', 'hydrogen', 'electrical'] }).bathCautions).toContain('caustic');
    expect(recomputeWorkbench(metricForm({ metalKey: 'Zn2+' }), 'metric', { words: 'Zinc, clear trivalent passivate', bathHazards: ['strong_acid', 'electrical'] }).bathCautions).not.toContain('caustic');
  });

  it('starts from the same part in either unit system, so the amp-hours do not change with the units', () => {
    const metric = recomputeWorkbench(metricForm(), 'metric');
    const us = recomputeWorkbench(usForm(), 'us');
    // 50 × 30 × 10 mm block: 2(50·30 + 50·10 + 30·10) = 4600 mm² = 0.46 dm² (geometry by hand).
    expect(metric.geometry?.areaDm2).toBeCloseTo(0.46, 9);
    // The US form shows it in inches to six significant figures (1.9685 × 1.1811 × 0.393701 in).
    expect(us.geometry?.areaDm2).toBeCloseTo(0.46, 5);
    expect(us.result?.estimate.nominal.ampHoursLot).toBeCloseTo(metric.result!.estimate.nominal.ampHoursLot, 2);
  });

  it('asks for an STL file when STL is chosen and none is measured', () => {
    expect(recomputeWorkbench(metricForm({ geometryMode: 'stl' }), 'metric').fieldErrors).toEqual({ stl: ['Choose an STL file of the part.'] });
  });
});
