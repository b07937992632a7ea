import { effectiveSampleMl, factorPerMl, type AnalysisMethod } from '@/lib/bath/methods/titration';

/** How the value is obtained, in a line or two: sample, titrant, indicator and factor, or the meter used. */
export function MethodNote({ method }: { method: AnalysisMethod }) {
  let detail: string;
  if (method.kind === 'titration') {
    const t = method.titrant;
    detail =
      `${effectiveSampleMl(method)} mL of bath, ${t.concentration} ${t.concentrationUnit} ${t.name}; ` +
      `${method.indicator}. Result = burette mL${method.blankMl ? ` − ${method.blankMl} mL blank` : ''} × ${factorPerMl(method).toPrecision(4)} ${method.unit}.`;
  } else if (method.kind === 'direct') {
    detail = method.procedure ?? 'Enter the reading as shown.';
  } else {
    detail = 'Worked out from the latest analyses below (filled in; change them if you have newer values).';
  }
  return (
    <div className="flex flex-col gap-1 text-sm text-ink-muted">
      <p className="font-medium text-ink">{method.name}</p>
      <p>{detail}</p>
      {'caution' in method && method.caution ? <p className="font-medium text-near">{method.caution}</p> : null}
    </div>
  );
}
