// One reading, start to finish: method → value → verdict → what to add or decant. Pure, so the
// floor screen shows exactly what the server will store, before saving and even offline.
import { AppError } from '../errors';
import { canConvert, convertSymbol } from './display';
import { getMethod } from './methods';
import { recommendCorrection, type Recommendation } from './recommend';
import type { AnalyteSupply } from './templates/supplies';
import type { AnalysisInputs } from './methods/titration';
import { computeAnalysis } from './methods/titration';
import { judgeValue, type Limits, type Verdict } from './verdict';

export type EvaluateAnalyte = {
  key: string;
  name: string;
  unit: string;
  methodId: string;
  limits: Limits & { target: number };
  supply: AnalyteSupply | null;
};

export type Evaluation =
  | { ok: true; value: number; unit: string; detail: string; verdict: Verdict; recommendation: Recommendation }
  | { ok: false; field: string; message: string };

function fail(field: string, message: string): Evaluation {
  return { ok: false, field, message };
}

export function evaluateReading(analyte: EvaluateAnalyte, volumeL: number, inputs: AnalysisInputs, entryUnit?: string): Evaluation {
  const method = getMethod(analyte.methodId);
  if (!method) return fail('method', `The analysis method "${analyte.methodId}" is not known: ask a supervisor to fix this analyte.`);
  let given = inputs;
  if (method.kind === 'direct' && entryUnit && entryUnit !== method.unit && method.reportAs === undefined) {
    if (!canConvert(entryUnit, method.unit)) return fail('reading', `A reading in ${entryUnit} cannot be used for a method in ${method.unit}.`);
    if (typeof inputs.reading === 'number' && Number.isFinite(inputs.reading)) {
      try {
        given = { ...inputs, reading: convertSymbol(inputs.reading, entryUnit, method.unit) };
      } catch (e) {
        return fail('reading', e instanceof Error ? e.message : 'The reading could not be converted.');
      }
    }
  }
  const result = computeAnalysis(method, given);
  if (!result.ok) return result;
  let value = result.value;
  if (result.unit !== analyte.unit) {
    if (!canConvert(result.unit, analyte.unit)) {
      return fail('method', `The method reports ${result.unit} but ${analyte.name} is kept in ${analyte.unit}: ask a supervisor to fix this analyte.`);
    }
    value = convertSymbol(value, result.unit, analyte.unit);
  }
  const judged = evaluateValue(analyte, volumeL, value);
  return judged.ok ? { ...judged, detail: result.detail } : judged;
}

/** Judges a value already in the analyte's unit (an outside lab's result) and says what to do. */
export function evaluateValue(analyte: EvaluateAnalyte, volumeL: number, value: number): Evaluation {
  try {
    const verdict = judgeValue(value, analyte.limits, { unit: analyte.unit });
    const recommendation = recommendCorrection({
      analyte: { key: analyte.key, name: analyte.name, unit: analyte.unit, target: analyte.limits.target, supply: analyte.supply },
      volumeL,
      measured: value,
      verdict: verdict.status,
    });
    return { ok: true, value, unit: analyte.unit, detail: 'value as reported', verdict, recommendation };
  } catch (e) {
    if (e instanceof AppError) return fail(Object.keys(e.fieldErrors ?? {})[0] ?? 'value', e.message);
    throw e;
  }
}
