// A lot record built in memory for the pure quality rules.
import type { LotRecord, LotReading } from '@/lib/quality/lot-types';
import { Z14_LEVEL_II } from '@/lib/quality/sampling';

export function reading(partNo: number, thicknessUm: number, over: Partial<LotReading> = {}): LotReading {
  const min = over.minimumUm ?? 8;
  const max = over.maximumUm ?? null;
  return {
    id: `r${partNo}-${thicknessUm}`,
    partNo,
    location: 'flat',
    method: 'B499',
    thicknessUm,
    minimumUm: min,
    maximumUm: max,
    status: thicknessUm < min ? 'below_minimum' : max !== null && thicknessUm > max ? 'above_maximum' : 'pass',
    entry: 'manual',
    recordedAt: new Date('2026-06-10T15:00:00Z'),
    recordedByName: 'Rosa Delgado',
    ...over,
  };
}

export function makeLot(over: Partial<LotRecord> = {}): LotRecord {
  return {
    order: {
      id: 'wo-1', number: 'W2026-00042', state: 'plated', poNumber: 'PO-7781', quantityOrdered: 40, quantityReceived: 40, quantityShipped: 0,
      bakeRequired: false, customerId: 'c-1', customerName: 'Northgate Fastener Co.', customerCode: 'NGF',
    },
    part: { partNumber: 'NGF-HX-0816', revision: 'C', description: 'Hex cap screw', substrate: 'carbon-steel', tensileMpa: 830, hardnessHrc: 25, areaDm2: 0.0915 },
    finish: {
      code: 'ZN-B633-SC2', name: 'Zinc, clear', specText: 'ASTM B633 Fe/Zn 8 (SC2) Type III', element: 'Zn', ionCharge: 2, minThicknessUm: 8,
      maxThicknessUm: null, bakeRequired: false, bakeThresholdHrc: 31, bakeWindowHours: 4, bakeTempC: 200, bakeHours: null,
    },
    runs: [
      {
        id: 'run-1', tankId: 't-zn', tankCode: 'Z-ZN1', tankName: 'Alkaline zinc', tankElement: 'Zn', startedAt: new Date('2026-06-10T13:00:00Z'),
        endedAt: new Date('2026-06-10T14:00:00Z'), ampHours: 12, conditions: {}, loads: 1, partsPerLoad: 40, predictedThicknessUm: 11,
      },
    ],
    readings: [],
    voidedReadingCount: 0,
    bakes: [],
    nonconformances: [],
    samplingPlan: { id: null, name: 'ANSI/ASQ Z1.4 general inspection level II', source: 'ANSI/ASQ Z1.4-2008', rows: [...Z14_LEVEL_II] },
    certificate: null,
    ...over,
  };
}
