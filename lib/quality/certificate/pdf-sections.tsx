// Sections of the certificate PDF: the readings table, the bake record and the bath analyses.
import type { BathTank, CertificateContent } from './content';
import { Fact, type Kit, pdfStyles, um } from './pdf-style';

/** Readings printed in full up to this many; the rest stay in the shop's record. */
export const PRINTED_READINGS = 40;

const STATUS_WORD: Record<string, string> = { pass: 'conforms', below_minimum: 'below minimum', above_maximum: 'above maximum' };

export function ReadingsTable({ k, readings }: { k: Kit; readings: CertificateContent['thickness']['readings'] }) {
  const { Text, View } = k;
  if (readings.length === 0) return null;
  const shown = readings.slice(0, PRINTED_READINGS);
  const col = [{ width: 44 }, { flex: 1 }, { width: 54 }, { width: 150 }, { width: 80 }];
  return (
    <View style={{ marginTop: 5 }}>
      <View style={pdfStyles.head} fixed>
        <Text style={col[0]}>Part</Text>
        <Text style={col[1]}>Location</Text>
        <Text style={col[2]}>Method</Text>
        <Text style={col[3]}>Thickness</Text>
        <Text style={col[4]}>Result</Text>
      </View>
      {shown.map((r, i) => (
        <View key={i} style={pdfStyles.row} wrap={false}>
          <Text style={[col[0]!, pdfStyles.mono]}>{r.partNo}</Text>
          <Text style={col[1]}>{r.location}</Text>
          <Text style={[col[2]!, pdfStyles.mono]}>{r.method}</Text>
          {/* Plex Mono's woff lacks a usable µ glyph in @react-pdf, so values stay in the sans. */}
          <Text style={col[3]}>{um(r.thicknessUm)}</Text>
          <Text style={col[4]}>{STATUS_WORD[r.status] ?? r.status}</Text>
        </View>
      ))}
      {readings.length > shown.length ? (
        <Text style={[pdfStyles.muted, { marginTop: 2 }]}>
          {readings.length - shown.length} further readings are kept in the shop's record of this lot.
        </Text>
      ) : null}
    </View>
  );
}

export function BakeSection({ k, c, at }: { k: Kit; c: CertificateContent; at: (t: string) => string }) {
  const { Text, View } = k;
  const b = c.bake;
  return (
    <View style={pdfStyles.section} wrap={false}>
      <Text style={pdfStyles.h2}>Hydrogen embrittlement relief bake</Text>
      {!b.required ? (
        <Text>{b.note}</Text>
      ) : (
        <>
          <View style={pdfStyles.grid}>
            <Fact k={k} label="Oven" value={b.oven} />
            <Fact k={k} label="Plating ended" value={at(b.platingEndedAt)} />
            <Fact k={k} label="Bake started" value={at(b.bakeStartedAt)} />
            <Fact k={k} label="Start by" value={at(b.deadlineAt)} />
            <Fact k={k} label="Temperature" value={b.tempMinC === b.tempMaxC ? `${b.tempMinC} °C` : `${b.tempMinC}–${b.tempMaxC} °C`} />
            <Fact k={k} label="Required" value={`${b.requiredTempC[0]}–${b.requiredTempC[1]} °C`} />
            <Fact k={k} label="Duration" value={`${b.durationH} h`} />
            <Fact k={k} label="Required time" value={b.requiredMinHours === null ? "per customer's specification" : `at least ${b.requiredMinHours} h`} />
          </View>
          <Text style={{ marginTop: 2 }}>
            {b.verdict === 'pass' ? 'The bake met the requirement.' : `The bake did not meet the requirement: ${b.reasons.join(' ')}`}
            {b.disposition ? ` Accepted by disposition of ${b.disposition.by ?? 'a supervisor'} on ${at(b.disposition.at)}: ${b.disposition.reason}` : ''}
          </Text>
          <Text style={[pdfStyles.muted, { marginTop: 2 }]}>{b.caution}</Text>
        </>
      )}
    </View>
  );
}

const BATH_STATUS: Record<string, string> = { in_range: 'in range', near_limit: 'near a limit', out_of_range: 'out of range' };

/** The tank's condition as the customer reads it: against the specification limits, not the shop's control band. */
function tankWords(tank: BathTank): string {
  if (tank.analyses.length === 0) return 'no analysis on record before the run';
  if (tank.withinSpec === undefined) return tank.inControl ? 'every analysis within its limits' : 'see the analyses below';
  return tank.withinSpec
    ? 'every analysis within its specification limits'
    : "outside a specification limit; the lot was released by a supervisor's recorded disposition";
}

export function BathSection({ k, c, at }: { k: Kit; c: CertificateContent; at: (t: string) => string }) {
  const { Text, View } = k;
  // One line per tank: its runs' amp-hours together and when the last one ended.
  const tanks = new Map<string, { name: string; runs: number; ampHours: number; lastEnd: string }>();
  for (const r of c.runs) {
    const t = tanks.get(r.tankCode) ?? { name: r.tankName, runs: 0, ampHours: 0, lastEnd: r.endedAt };
    tanks.set(r.tankCode, { name: t.name, runs: t.runs + 1, ampHours: t.ampHours + (r.ampHours ?? 0), lastEnd: r.endedAt > t.lastEnd ? r.endedAt : t.lastEnd });
  }
  const runs = [...tanks]
    .map(([code, t]) => `${code} ${t.name} (${t.runs} ${t.runs === 1 ? 'run' : 'runs'}${t.ampHours > 0 ? `, ${t.ampHours.toFixed(1)} A·h` : ''}, last ended ${at(t.lastEnd)})`)
    .join('; ');
  return (
    <View style={pdfStyles.section} wrap={false}>
      <Text style={pdfStyles.h2}>Plating and bath condition</Text>
      <Text>Plated in: {runs || '—'}.</Text>
      {!c.bath.available ? (
        <Text style={pdfStyles.muted}>{c.bath.note}</Text>
      ) : (
        c.bath.tanks.map((tank) => (
          <View key={tank.code} style={{ marginTop: 3 }}>
            <Text style={{ fontWeight: 600 }}>
              {tank.code} {tank.name}:{' '}
              {tankWords(tank)}
            </Text>
            {tank.analyses.map((a, i) => (
              <Text key={i}>
                {a.analyte}: {a.value} {a.unit}, {a.withinSpec === undefined ? (BATH_STATUS[a.status] ?? a.status) : a.withinSpec ? 'within specification' : 'outside specification'}, analysed {at(a.analysedAt)}
              </Text>
            ))}
            {tank.note ? <Text style={pdfStyles.muted}>{tank.note}</Text> : null}
          </View>
        ))
      )}
    </View>
  );
}
