// One lot's quality record as the pure rules see it: plain values, dates as Date, no database.
import type { Disposition, NonconformanceSource, ReadingStatusColumn, StoredBakeReason, ThicknessMethod } from '@/db/types/quality';
import type { ProcessFamilyId, ProcessRecordKind, WorkOrderState } from '@/db/types';
import type { SamplingRow } from './sampling';

export type LotOrder = {
  id: string;
  number: string;
  state: WorkOrderState;
  poNumber: string;
  quantityOrdered: number;
  quantityReceived: number;
  quantityShipped: number;
  bakeRequired: boolean;
  customerId: string;
  customerName: string;
  customerCode: string;
};

export type LotPart = {
  partNumber: string;
  revision: string;
  description: string;
  substrate: string;
  tensileMpa: number | null;
  hardnessHrc: number | null;
  areaDm2: number;
  /** The service environment the customer stated (ISO 9223), where given. */
  corrosivityCategory?: 'C1' | 'C2' | 'C3' | 'C4' | 'C5' | 'CX' | null;
};

export type LotFinish = {
  /** The finish's process family and its own figures (absent in lots built before families: electroplating). */
  family?: ProcessFamilyId;
  familyParams?: Record<string, unknown>;
  code: string;
  name: string;
  specText: string;
  element: string;
  ionCharge: number;
  minThicknessUm: number;
  maxThicknessUm: number | null;
  bakeRequired: boolean;
  bakeThresholdHrc: number | null;
  bakeWindowHours: number | null;
  bakeTempC: number | null;
  bakeHours: number | null;
};

export type LotRun = {
  id: string;
  tankId: string;
  tankCode: string;
  tankName: string;
  tankElement: string | null;
  startedAt: Date;
  endedAt: Date;
  /** Null for a run without current (electroless nickel, passivation). */
  ampHours: number | null;
  /** Bath conditions of a run without current (temperatureC, concentration). */
  conditions: Record<string, number>;
  loads: number;
  partsPerLoad: number;
  predictedThicknessUm: number;
};

export type LotReading = {
  id: string;
  partNo: number;
  location: string;
  method: ThicknessMethod;
  thicknessUm: number;
  minimumUm: number;
  maximumUm: number | null;
  status: ReadingStatusColumn;
  entry: 'manual' | 'csv';
  recordedAt: Date;
  recordedByName: string | null;
};

export type LotBake = {
  id: string;
  platingEndedAt: Date;
  oven: string;
  bakeStartedAt: Date;
  tempMinC: number;
  tempMaxC: number;
  durationH: number;
  hasChart: boolean;
  chartFileId: string | null;
  requiredMinHours: number | null;
  requiredMinTempC: number;
  requiredMaxTempC: number;
  windowHours: number;
  deadlineAt: Date;
  verdict: 'pass' | 'fail';
  reasons: StoredBakeReason[];
  notes: string;
  recordedAt: Date;
  recordedByName: string | null;
  dispositionReason: string | null;
  dispositionAt: Date | null;
  dispositionByName: string | null;
};

export type LotNonconformance = {
  id: string;
  source: NonconformanceSource;
  description: string;
  openedAt: Date;
  openedByName: string | null;
  disposition: Disposition | null;
  customerApprovalRef: string | null;
  dispositionNote: string | null;
  dispositionedAt: Date | null;
  dispositionedByName: string | null;
  closedAt: Date | null;
};

export type LotSamplingPlan = { id: string | null; name: string; source: string; rows: SamplingRow[] };

export type LotCertificate = { id: string; number: string; signedAt: Date; signedByName: string };

/** A family's own lot record (seal test, phosphorus, passivation verification, salt spray). */
export type LotProcessRecord = {
  id: string;
  kind: ProcessRecordKind;
  method: string;
  values: Record<string, number | string>;
  verdict: 'pass' | 'fail';
  reasons: string[];
  notes: string;
  recordedAt: Date;
  recordedByName: string | null;
};

export type LotRecord = {
  processRecords?: LotProcessRecord[];
  /** The shop's own data for the finish's family (lib/families/shop-data), e.g. its passivation windows. */
  familyData?: Record<string, unknown>;
  order: LotOrder;
  part: LotPart;
  finish: LotFinish;
  runs: LotRun[];
  readings: LotReading[];
  voidedReadingCount: number;
  bakes: LotBake[];
  nonconformances: LotNonconformance[];
  samplingPlan: LotSamplingPlan;
  certificate: LotCertificate | null;
};

export const DISPOSITION_LABELS: Record<Disposition, string> = {
  rework: 'Rework',
  strip_and_replate: 'Strip and replate',
  use_as_is: "Use as is (customer's approval)",
  scrap: 'Scrap',
};

export const DISPOSITIONS_LIST = Object.keys(DISPOSITION_LABELS) as [Disposition, ...Disposition[]];
