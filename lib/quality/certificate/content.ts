// What a certificate of conformance says, built once from the lot's records when it is issued and
// then kept as it is (the stored snapshot and PDF never change). Pure: the same lot and signer
// give the same content, so it can be checked in tests and rendered anywhere.
import { BAKE_CAUTION } from '../bake';
import { LIFE_DISCLAIMER } from '@/lib/families/electroplating';
import { describeZincLife, ZINC_LIFE_STANDARD, zincServiceLife } from '@/lib/plating';
import { lotBake, lotFamily, lotSample, latestBake, runMinutesPerLoad, thicknessState } from '../lot-checks';
import { describeRecord, PROCESS_RECORD_LABELS } from '../process/rules';
import { DISPOSITION_LABELS, type LotRecord } from '../lot-types';
import { methodLabel } from '../methods';

/**
 * `status` and `inControl` are the shop's own working band and control rules (for the supervisor);
 * `withinSpec` is what the certificate tells the customer: inside the specification limits or not.
 * Certificates issued before `withinSpec` was recorded lack it.
 */
export type BathAnalysis = { analyte: string; value: number; unit: string; analysedAt: string; status: 'in_range' | 'near_limit' | 'out_of_range'; withinSpec?: boolean };
export type BathTank = { code: string; name: string; inControl: boolean | null; withinSpec?: boolean | null; analyses: BathAnalysis[]; note: string | null; rulesFired?: string[] };
export type BathSnapshot = { available: true; tanks: BathTank[] } | { available: false; note: string };

export type CertificateContent = {
  version: 1;
  number: string;
  issuedAt: string;
  timeZone: string;
  shop: { name: string; address: string; phone: string; email: string };
  customer: { name: string; code: string };
  order: { number: string; poNumber: string; quantity: number };
  part: { number: string; revision: string; description: string; substrate: string };
  finish: { code: string; name: string; specText: string; minThicknessUm: number; maxThicknessUm: number | null };
  runs: { tankCode: string; tankName: string; endedAt: string; ampHours: number | null }[];
  bath: BathSnapshot;
  thickness: {
    planName: string;
    planSource: string;
    lotSize: number;
    sampleSize: number;
    codeLetter: string | null;
    partsMeasured: number;
    methods: string[];
    count: number;
    meanUm: number;
    minUm: number;
    maxUm: number;
    stdDevUm: number | null;
    failingAcceptedByDisposition: number;
    readings: { partNo: number; location: string; method: string; thicknessUm: number; status: string }[];
  };
  bake:
    | { required: false; note: string }
    | {
        required: true;
        oven: string;
        platingEndedAt: string;
        bakeStartedAt: string;
        deadlineAt: string;
        tempMinC: number;
        tempMaxC: number;
        durationH: number;
        requiredMinHours: number | null;
        requiredTempC: [number, number];
        verdict: 'pass' | 'fail';
        reasons: string[];
        disposition: { reason: string; by: string | null; at: string } | null;
        caution: string;
      };
  nonconformances: { description: string; disposition: string; customerApprovalRef: string | null; closedAt: string | null }[];
  /** What was done in the trade's words, the family's own records, and the coating life where asked (absent on older certificates). */
  process?: {
    family: string;
    statement: string;
    /** Whether the family makes a coating whose thickness the certificate reports. */
    reportsThickness: boolean;
    records: { label: string; result: string; verdict: 'pass' | 'fail'; recordedAt: string }[];
    /** Per-run bath conditions, for a family judged by a window (passivation). */
    runConditions: string[];
    life: { category: string; text: string; standard: string; note: string } | null;
  };
  statement: string;
  signedBy: { name: string; role: string };
  signedAt: string;
};

export type ShopDetails = CertificateContent['shop'];

export const CONFORMANCE_STATEMENT =
  'We certify that the parts named above were processed as recorded here and conform to the finish specification stated, ' +
  "on the evidence of the thickness, bake and bath records summarised on this certificate. Where the customer's drawing or " +
  'purchase order adds requirements, those requirements govern.';

const iso = (d: Date) => d.toISOString();

/** The family's section of the certificate: its statement, its records, the life estimate where asked. */
function processSection(lot: LotRecord): NonNullable<CertificateContent['process']> {
  const { family, params } = lotFamily(lot);
  const windowRun = family.quality.some((q) => q.kind === 'passivation_lot');
  const category = lot.part.corrosivityCategory;
  // Zinc life by ISO 9223 category, from the measured minimum where there is one, else the specified minimum.
  const zincUm = lot.readings.length ? Math.min(...lot.readings.map((r) => r.thicknessUm)) : lot.finish.minThicknessUm;
  const life =
    category && lot.finish.element === 'Zn' && family.id === 'electroplating'
      ? { category, text: describeZincLife(zincServiceLife({ thicknessUm: zincUm, category }), category), standard: ZINC_LIFE_STANDARD, note: LIFE_DISCLAIMER }
      : null;
  return {
    family: family.label,
    statement: family.certificateStatement(lot.finish, params as never),
    reportsThickness: family.quality.some((q) => q.kind === 'thickness'),
    records: (lot.processRecords ?? []).map((r) => ({ label: PROCESS_RECORD_LABELS[r.kind], result: describeRecord(r), verdict: r.verdict, recordedAt: iso(r.recordedAt) })),
    runConditions: windowRun
      ? lot.runs.map((r) => `${r.tankCode}, ${iso(r.endedAt).slice(0, 10)}: ${Math.round(runMinutesPerLoad(r))} min at ${r.conditions.temperatureC ?? '—'} °C, acid ${r.conditions.concentration ?? '—'} %`)
      : [],
    life,
  };
}

export function buildCertificateContent(
  lot: LotRecord,
  opts: { number: string; signedAt: Date; signer: { name: string; role: string }; shop: ShopDetails; bath: BathSnapshot; timeZone: string },
): CertificateContent {
  const t = thicknessState(lot);
  const sample = lotSample(lot);
  const req = lotBake(lot);
  const last = latestBake(lot);
  const summary = t.summary;
  const quantity = lot.order.quantityShipped || lot.order.quantityReceived || lot.order.quantityOrdered;
  return {
    version: 1,
    number: opts.number,
    issuedAt: iso(opts.signedAt),
    timeZone: opts.timeZone,
    shop: opts.shop,
    customer: { name: lot.order.customerName, code: lot.order.customerCode },
    order: { number: lot.order.number, poNumber: lot.order.poNumber, quantity },
    part: { number: lot.part.partNumber, revision: lot.part.revision, description: lot.part.description, substrate: lot.part.substrate },
    finish: {
      code: lot.finish.code,
      name: lot.finish.name,
      specText: lot.finish.specText,
      minThicknessUm: lot.finish.minThicknessUm,
      maxThicknessUm: lot.finish.maxThicknessUm,
    },
    runs: lot.runs.map((r) => ({ tankCode: r.tankCode, tankName: r.tankName, endedAt: iso(r.endedAt), ampHours: r.ampHours })),
    bath: opts.bath,
    thickness: {
      planName: sample.planName,
      planSource: sample.source,
      lotSize: sample.lotSize,
      sampleSize: sample.sampleSize,
      codeLetter: sample.codeLetter,
      partsMeasured: t.partsMeasured,
      methods: [...new Set(lot.readings.map((r) => methodLabel(r.method)))],
      count: summary?.count ?? 0,
      meanUm: summary?.mean ?? 0,
      minUm: summary?.min ?? 0,
      maxUm: summary?.max ?? 0,
      stdDevUm: summary?.stdDev ?? null,
      failingAcceptedByDisposition: t.failing.length - t.unresolved.length,
      readings: lot.readings.map((r) => ({ partNo: r.partNo, location: r.location, method: r.method, thicknessUm: r.thicknessUm, status: r.status })),
    },
    bake:
      !req.required || !last
        ? { required: false, note: req.required ? 'Relief bake required but not recorded.' : 'No relief bake required for this lot.' }
        : {
            required: true,
            oven: last.oven,
            platingEndedAt: iso(last.platingEndedAt),
            bakeStartedAt: iso(last.bakeStartedAt),
            deadlineAt: iso(last.deadlineAt),
            tempMinC: last.tempMinC,
            tempMaxC: last.tempMaxC,
            durationH: last.durationH,
            requiredMinHours: last.requiredMinHours,
            requiredTempC: [last.requiredMinTempC, last.requiredMaxTempC],
            verdict: last.verdict,
            reasons: last.reasons.map((r) => r.message),
            disposition: last.dispositionAt
              ? { reason: last.dispositionReason ?? '', by: last.dispositionByName, at: iso(last.dispositionAt) }
              : null,
            caution: BAKE_CAUTION,
          },
    nonconformances: lot.nonconformances.map((n) => ({
      description: n.description,
      disposition: n.disposition ? DISPOSITION_LABELS[n.disposition] : 'Open',
      customerApprovalRef: n.customerApprovalRef,
      closedAt: n.closedAt ? iso(n.closedAt) : null,
    })),
    process: processSection(lot),
    statement: CONFORMANCE_STATEMENT,
    signedBy: opts.signer,
    signedAt: iso(opts.signedAt),
  };
}
