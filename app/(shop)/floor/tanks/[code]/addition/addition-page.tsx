'use client';

import { useState } from 'react';
import type { UnitSystem } from '@/lib/plating/units';
import { AdditionForm, type AdditionDefaults } from '../../../_ui/addition-form';
import { AdditiveDoses, type DoseRow } from '../../../_ui/additive-doses';

type Props = {
  tank: { id: string; code: string };
  analytes: { id: string; name: string; material: string | null }[];
  doses: DoseRow[];
  system: UnitSystem;
};

export function AdditionPage({ tank, analytes, doses, system }: Props) {
  const [defaults, setDefaults] = useState<AdditionDefaults>({ kind: 'other' });
  const [version, setVersion] = useState(0);
  return (
    <div className="flex flex-col gap-5">
      <AdditiveDoses
        doses={doses}
        system={system}
        onRecord={(d) => {
          setDefaults({ analyteId: d.analyteId, material: d.material, amount: d.doseL, unit: 'L', recommendedAmount: d.doseL, recommendedUnit: 'L', kind: 'amp_hours', reason: 'Amp-hour replenishment' });
          setVersion((v) => v + 1);
        }}
      />
      <div className="rounded-lg border border-surface-line bg-surface p-4">
        <AdditionForm key={version} tank={tank} analytes={analytes} defaults={defaults} system={system} />
      </div>
    </div>
  );
}
