// What a lot's records say about it: enough thickness readings for the sample, all passing (or
// accepted by disposition), the relief bake done right (or dispositioned), no open nonconformance.
// Pure. The work-order guards and the certificate both ask these questions, so each refusal
// reads the same wherever it appears.
import { lotBakeRequirement, type LotBakeRequirement } from './bake/rules';
import type { ProcessRecordKind } from '@/db/types';
import { getFamily } from '@/lib/families';
import { windowsOf } from '@/lib/families/passivation/windows';
import { checkPassivation } from '@/lib/plating';
import type { LotBake, LotProcessRecord, LotRecord, LotReading } from './lot-types';
import { describeRecord, PROCESS_RECORD_LABELS } from './process/rules';
import { sampleSizeFor, Z14_LEVEL_II, type SampleSize } from './sampling';
import { summarize, type ReadingSummary } from './stats';

export type CheckKey =
  | 'runs'
  | 'thickness_count'
  | 'thickness_pass'
  | 'bake'
  | 'nonconformance'
  | 'seal_test'
  | 'phosphorus_content'
  | 'passivation_lot'
  | 'passivation_test'
  | 'salt_spray'
  | 'inspected';
export type LotCheck = { key: CheckKey; ok: boolean; message: string };

export const MESSAGES = {
  noRuns: 'No plating runs are recorded for this order.',
  bakeMissing: 'The embrittlement-relief bake has not been recorded.',
  bakeNotRequired: 'No relief bake is required for this lot.',
} as const;

export function lotSize(lot: LotRecord): number {
  return lot.order.quantityReceived > 0 ? lot.order.quantityReceived : lot.order.quantityOrdered;
}

export function lotSample(lot: LotRecord): SampleSize & { planName: string; source: string } {
  const size = lotSize(lot);
  try {
    return { ...sampleSizeFor(size, lot.samplingPlan.rows), planName: lot.samplingPlan.name, source: lot.samplingPlan.source };
  } catch {
    // A stored plan is validated when saved; this is only reached with no plan at all.
    return { ...sampleSizeFor(size, Z14_LEVEL_II), planName: 'ANSI/ASQ Z1.4 general inspection level II', source: 'ANSI/ASQ Z1.4-2008 Tables I and II-A' };
  }
}

export function lotBake(lot: LotRecord): LotBakeRequirement {
  return lotBakeRequirement({
    orderBakeRequired: lot.order.bakeRequired,
    part: { tensileMpa: lot.part.tensileMpa, hardnessHrc: lot.part.hardnessHrc },
    finish: lot.finish,
  });
}

/** Failing readings taken before a "use as is" disposition are covered by the customer's approval. */
export function acceptedByDisposition(lot: LotRecord, r: LotReading): boolean {
  return lot.nonconformances.some(
    (nc) => nc.disposition === 'use_as_is' && nc.source !== 'bake' && nc.dispositionedAt !== null && nc.dispositionedAt >= r.recordedAt,
  );
}

export type ThicknessState = {
  sample: ReturnType<typeof lotSample>;
  partsMeasured: number;
  summary: ReadingSummary | null;
  failing: LotReading[];
  unresolved: LotReading[];
  count: LotCheck;
  pass: LotCheck;
};

const fmt = (x: number) => String(Math.round(x * 100) / 100);

export function thicknessState(lot: LotRecord): ThicknessState {
  const sample = lotSample(lot);
  const partsMeasured = new Set(lot.readings.map((r) => r.partNo)).size;
  const summary = lot.readings.length ? summarize(lot.readings.map((r) => r.thicknessUm)) : null;
  const failing = lot.readings.filter((r) => r.status !== 'pass');
  const unresolved = failing.filter((r) => !acceptedByDisposition(lot, r));
  const lot$ = sample.lotSize.toLocaleString('en-US');
  const plan = sample.inspectAll ? `every part of the lot of ${lot$}` : `lot of ${lot$}, code ${sample.codeLetter}`;
  const count: LotCheck =
    partsMeasured >= sample.sampleSize
      ? { key: 'thickness_count', ok: true, message: `${partsMeasured} of ${sample.sampleSize} sampled parts measured (${plan}).` }
      : {
          key: 'thickness_count',
          ok: false,
          message: `Thickness readings are missing: ${partsMeasured} of ${sample.sampleSize} sampled parts measured (${plan}).`,
        };
  let pass: LotCheck;
  if (lot.readings.length === 0) pass = { key: 'thickness_pass', ok: false, message: 'No thickness readings yet.' };
  else if (unresolved.length === 0) {
    pass = {
      key: 'thickness_pass',
      ok: true,
      message:
        failing.length === 0
          ? `All ${lot.readings.length} readings meet the specification.`
          : `${failing.length} failing readings accepted by a "use as is" disposition with the customer's approval.`,
    };
  } else {
    const below = unresolved.filter((r) => r.status === 'below_minimum');
    const above = unresolved.filter((r) => r.status === 'above_maximum');
    const parts = [
      below.length ? `${below.length} below the minimum ${fmt(below[0]!.minimumUm)} µm (lowest ${fmt(Math.min(...below.map((r) => r.thicknessUm)))} µm)` : '',
      above.length ? `${above.length} above the maximum ${fmt(above[0]!.maximumUm ?? 0)} µm (highest ${fmt(Math.max(...above.map((r) => r.thicknessUm)))} µm)` : '',
    ].filter(Boolean);
    pass = {
      key: 'thickness_pass',
      ok: false,
      message: `${unresolved.length} of ${lot.readings.length} thickness readings fail the specification: ${parts.join('; ')}.`,
    };
  }
  return { sample, partsMeasured, summary, failing, unresolved, count, pass };
}

export function latestBake(lot: LotRecord): LotBake | null {
  return lot.bakes.length ? [...lot.bakes].sort((a, b) => a.recordedAt.getTime() - b.recordedAt.getTime()).at(-1)! : null;
}

export function bakeCheck(lot: LotRecord): LotCheck {
  const req = lotBake(lot);
  if (!req.required) return { key: 'bake', ok: true, message: MESSAGES.bakeNotRequired };
  const last = latestBake(lot);
  if (!last) return { key: 'bake', ok: false, message: MESSAGES.bakeMissing };
  if (last.verdict === 'pass') return { key: 'bake', ok: true, message: 'The relief bake meets the requirement.' };
  const reasons = last.reasons.map((r) => r.message).join(' ');
  if (last.dispositionAt) {
    return { key: 'bake', ok: true, message: `The bake failed (${reasons}) and was accepted by a supervisor's disposition: ${last.dispositionReason}` };
  }
  return { key: 'bake', ok: false, message: `The bake record fails: ${reasons} A supervisor's disposition is needed before the order can be marked baked.` };
}

export function nonconformanceCheck(lot: LotRecord): LotCheck {
  const open = lot.nonconformances.filter((n) => n.disposition === null);
  if (open.length) {
    const what = open.map((n) => `“${n.description.length > 140 ? `${n.description.slice(0, 139)}…` : n.description}”`).join(', ');
    return {
      key: 'nonconformance',
      ok: false,
      message: `${open.length === 1 ? 'A nonconformance is' : `${open.length} nonconformances are`} open (${what}): a disposition is needed first.`,
    };
  }
  const scrapped = lot.nonconformances.find((n) => n.disposition === 'scrap');
  if (scrapped) return { key: 'nonconformance', ok: false, message: 'The lot was scrapped by a nonconformance disposition.' };
  return { key: 'nonconformance', ok: true, message: 'No open nonconformance.' };
}

export function runsCheck(lot: LotRecord): LotCheck {
  return lot.runs.length ? { key: 'runs', ok: true, message: `${lot.runs.length} plating run${lot.runs.length === 1 ? '' : 's'} recorded.` } : { key: 'runs', ok: false, message: MESSAGES.noRuns };
}

/** The lot's family and its own figures (a lot loaded before families is electroplating). */
export function lotFamily(lot: LotRecord) {
  const family = getFamily(lot.finish.family);
  const parsed = family.paramsSchema.safeParse(lot.finish.familyParams ?? family.defaultParams);
  return { family, params: parsed.success ? parsed.data : family.defaultParams };
}

function latestRecord(lot: LotRecord, kind: ProcessRecordKind): LotProcessRecord | null {
  const rs = (lot.processRecords ?? []).filter((r) => r.kind === kind);
  return rs.length ? rs.reduce((a, b) => (b.recordedAt >= a.recordedAt ? b : a)) : null;
}

/** A family record the lot needs: missing, failing, or passing with what it showed. */
export function recordCheck(lot: LotRecord, kind: Exclude<ProcessRecordKind, 'passivation_lot'>): LotCheck {
  const label = PROCESS_RECORD_LABELS[kind];
  const last = latestRecord(lot, kind);
  if (!last) return { key: kind, ok: false, message: `The ${label.toLowerCase()} has not been recorded.` };
  if (last.verdict === 'fail') return { key: kind, ok: false, message: `The latest ${label.toLowerCase()} fails: ${last.reasons.join(' ')}` };
  return { key: kind, ok: true, message: `${label} passes: ${describeRecord(last)}.` };
}

/** Minutes a run spent in the bath per load, from its start, end and loads. */
export function runMinutesPerLoad(r: { startedAt: Date; endedAt: Date; loads: number }): number {
  return (r.endedAt.getTime() - r.startedAt.getTime()) / 60_000 / Math.max(1, r.loads);
}

/**
 * ASTM A967 §5.2.2: the lot's time, temperature and concentration, run by run, inside the window.
 * A run outside it has opened a nonconformance; only the customer's "use as is" lets it pass.
 */
export function passivationLotCheck(lot: LotRecord, windowId: string): LotCheck {
  if (lot.runs.length === 0) return { key: 'passivation_lot', ok: false, message: 'No passivation run with its conditions is recorded.' };
  const missing = lot.runs.filter((r) => r.conditions.temperatureC === undefined || r.conditions.concentration === undefined);
  if (missing.length) return { key: 'passivation_lot', ok: false, message: `${missing.length} run${missing.length === 1 ? ' has' : 's have'} no bath temperature or concentration recorded.` };
  const accepted = lot.nonconformances.some((nc) => nc.disposition === 'use_as_is');
  const windows = windowsOf(lot.familyData);
  const outside = lot.runs
    .map((r) => checkPassivation({ windowId, temperatureC: r.conditions.temperatureC!, minutes: runMinutesPerLoad(r), concentration: r.conditions.concentration! }, windows))
    .filter((v) => !v.ok);
  if (outside.length && !accepted) {
    return { key: 'passivation_lot', ok: false, message: `${outside.length} run${outside.length === 1 ? ' was' : 's were'} outside the treatment's window: a nonconformance needs the customer's disposition.` };
  }
  const w = outside[0]?.window ?? checkPassivation({ windowId, temperatureC: lot.runs[0]!.conditions.temperatureC!, minutes: runMinutesPerLoad(lot.runs[0]!), concentration: lot.runs[0]!.conditions.concentration! }, windows).window;
  return {
    key: 'passivation_lot',
    ok: true,
    message: outside.length
      ? `Runs outside ${w.standard} ${w.treatment} were accepted by the customer's "use as is".`
      : `Every run sat inside ${w.standard} ${w.treatment}: ${lot.runs.map((r) => `${Math.round(runMinutesPerLoad(r))} min at ${r.conditions.temperatureC} °C, ${r.conditions.concentration} %`).join('; ')}.`,
  };
}

/** What inspection asks of the lot, by its family: thickness, the family's records, no open nonconformance. */
export function inspectionChecks(lot: LotRecord): LotCheck[] {
  const { family, params } = lotFamily(lot);
  const checks: LotCheck[] = [];
  for (const q of family.quality) {
    if (q.kind === 'thickness') {
      const t = thicknessState(lot);
      checks.push(t.count, t.pass);
    } else if (q.kind === 'passivation_lot') {
      checks.push(passivationLotCheck(lot, String(params.windowId)));
    } else if (q.kind === 'salt_spray') {
      if (typeof params.saltSprayHours === 'number') checks.push(recordCheck(lot, 'salt_spray'));
    } else if (q.kind !== 'bake') {
      checks.push(recordCheck(lot, q.kind));
    }
  }
  checks.push(nonconformanceCheck(lot));
  return checks;
}

/** Every record check, in the order a certificate asks them. */
export function lotChecks(lot: LotRecord): LotCheck[] {
  const inspection = inspectionChecks(lot);
  return [runsCheck(lot), ...inspection.slice(0, -1), bakeCheck(lot), inspection.at(-1)!];
}

const CERTIFIABLE_STATES = new Set(['inspected', 'shipped', 'invoiced']);
const STATE_WORDS: Record<string, string> = {
  accepted: 'awaiting parts', received: 'received', in_process: 'in process', plated: 'plated', baked: 'baked',
};

/** A certificate speaks for an inspected lot: the order must have passed its inspection step. */
export function inspectedCheck(lot: LotRecord): LotCheck {
  return CERTIFIABLE_STATES.has(lot.order.state)
    ? { key: 'inspected', ok: true, message: 'The lot has passed inspection.' }
    : { key: 'inspected', ok: false, message: `The order is ${STATE_WORDS[lot.order.state] ?? lot.order.state}, not yet inspected: a certificate is issued once the lot passes inspection.` };
}

/** What a certificate asks: every record, then the inspection step itself. */
export function certificateChecks(lot: LotRecord): LotCheck[] {
  return [...lotChecks(lot), inspectedCheck(lot)];
}
