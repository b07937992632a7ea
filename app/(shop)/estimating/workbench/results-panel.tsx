'use client';

import { Card } from '@/components/ui/card';
import { Table, TBody, Td, Th, THead, Tr } from '@/components/ui/table';
import { ESTIMATE_CAUTION, type UnitSystem } from '@/lib/plating';
import { figureSet, FIGURES, sensitivityRows, type FigureKey, type FigureSet } from '@/lib/estimating/figures';
import { formatMeasure, formatValue } from '@/lib/estimating/format';
import type { WorkbenchView } from '@/lib/estimating/recompute';

const GROUPS: { title: string; keys: FigureKey[] }[] = [
  { title: 'Part and lot', keys: ['areaPerPart', 'areaPerLot', 'minimumThickness', 'averageThickness', 'depositMassPerPart'] },
  { title: 'Tank', keys: ['partsPerLoad', 'loads', 'currentPerLoad', 'ampHoursPerLoad', 'ampHoursLot', 'minutesPerLoad', 'totalTankTime'] },
  { title: 'Metal', keys: ['metalDeposited', 'metalDraggedOut', 'metalAnodeLoss', 'metalConsumed', 'saltToAdd'] },
  { title: 'Energy', keys: ['energyDc', 'energyAc'] },
];

function note(key: FigureKey, view: NonNullable<WorkbenchView['result']>): string | null {
  const e = view.estimate;
  switch (key) {
    case 'averageThickness':
      return `minimum ÷ ${e.distributionRatio}${e.distributionRatioIsDefault ? ' (default)' : ''}`;
    case 'partsPerLoad':
      return e.loadLimitedBy === 'rectifier' ? 'limited by the rectifier' : 'rack or barrel capacity';
    case 'loads':
      return e.loads > 1 && e.partsInLastLoad !== e.partsPerLoad ? `last load ${e.partsInLastLoad} parts` : null;
    case 'totalTankTime':
      return 'plating only; handling is extra';
    case 'saltToAdd': {
      const salt = e.nominal.salt;
      return salt ? `${salt.formula}, ${(salt.metalFraction * 100).toFixed(1)} % metal` : null;
    }
    default:
      return null;
  }
}

export function ResultsPanel({ view, system }: { view: WorkbenchView; system: UnitSystem }) {
  const result = view.result;
  const formErrors = [...(view.fieldErrors._form ?? [])];
  if (!result) {
    return (
      <Card title="Results" description="Figures appear as soon as every field is valid.">
        <p className="text-sm text-ink-muted" data-testid="results-waiting">
          Fix the highlighted fields to see the figures.
        </p>
        {formErrors.length ? <p className="mt-2 text-sm text-out">{formErrors.join(' ')}</p> : null}
      </Card>
    );
  }
  const e = result.estimate;
  const figures: FigureSet = figureSet(e, e.nominal, system);
  const sensitivity = sensitivityRows(e, system);
  const pct = (f: number) => `${formatValue(f * 100, '', 3)} %`;
  return (
    <Card title="Results" description={`${e.metal.name} (${e.metal.ion}) at ${pct(e.nominal.efficiency)} cathode efficiency.`}>
      <div className="flex flex-col gap-5" data-testid="workbench-results">
        {GROUPS.map((g) => (
          <Table key={g.title} caption={g.title} dense>
            <TBody>
              {g.keys
                .filter((k) => figures[k] !== undefined)
                .map((k) => (
                  <Tr key={k}>
                    <Th scope="row" className="w-1/2 font-normal text-ink-muted">
                      {FIGURES[k].label}
                    </Th>
                    <Td numeric data-figure={k}>
                      {formatMeasure(figures[k])}
                      {note(k, result) ? <div className="text-xs text-ink-muted">{note(k, result)}</div> : null}
                    </Td>
                  </Tr>
                ))}
            </TBody>
          </Table>
        ))}

        {e.lowerEfficiency ? (
          <Table caption={`Sensitivity: at ${pct(e.lowerEfficiency.efficiency)} efficiency instead of ${pct(e.nominal.efficiency)}`} dense data-testid="sensitivity">
            <THead>
              <Tr>
                <Th>Figure</Th>
                <Th numeric>At {pct(e.nominal.efficiency)}</Th>
                <Th numeric>At {pct(e.lowerEfficiency.efficiency)}</Th>
                <Th numeric>Change</Th>
              </Tr>
            </THead>
            <TBody>
              {sensitivity.map((r) => (
                <Tr key={r.key}>
                  <Th scope="row" className="font-normal text-ink-muted">
                    {r.label}
                  </Th>
                  <Td numeric>{formatMeasure(r.nominal)}</Td>
                  <Td numeric>{formatMeasure(r.lower)}</Td>
                  <Td numeric>{r.changePercent >= 0 ? '+' : ''}{formatValue(r.changePercent, '', 3)} %</Td>
                </Tr>
              ))}
            </TBody>
          </Table>
        ) : (
          <p className="text-sm text-ink-muted">{e.lowerEfficiencyNote}</p>
        )}
        <p className="text-xs text-ink-muted">{ESTIMATE_CAUTION}</p>
      </div>
    </Card>
  );
}
