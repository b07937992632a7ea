'use client';

import { Card } from '@/components/ui/card';
import { Caution } from '@/components/ui/caution';
import { SelectField } from '@/components/ui/field';
import { CONTACT_LIMITS_V, GALVANIC_MATERIALS, STANDARD_POTENTIAL_SOURCE, type ServiceEnvironment } from '@/lib/plating';
import { formatValue } from '@/lib/estimating/format';
import type { WorkbenchView } from '@/lib/estimating/recompute';
import type { PanelProps } from './panel';

const ENVIRONMENT_LABELS: Record<ServiceEnvironment, string> = {
  harsh: 'Harsh (outdoors, salt, high humidity)',
  normal: 'Normal (sheltered, some humidity)',
  controlled: 'Controlled (temperature and humidity controlled)',
};

const volts = (v: number) => formatValue(v, 'V', 3);

export function SafetyPanel(p: PanelProps & { view: WorkbenchView }) {
  const { form, set, view } = p;
  const result = view.result;
  return (
    <Card title="Safety and corrosion" description="Cautions for this process and part, and how the coating behaves against the metals it touches.">
      <div className="flex flex-col gap-4">
        {view.safety.map((n) => (
          <Caution key={n.kind} kind={n.kind}>
            {n.detail}
          </Caution>
        ))}
        {view.bathCautions.length ? <Caution kind={view.bathCautions} compact /> : null}

        {result?.galvanic ? (
          <div className="text-sm" data-testid="galvanic">
            <h3 className="font-semibold">
              {GALVANIC_MATERIALS[result.galvanic.coating].name} on {GALVANIC_MATERIALS[result.galvanic.substrate].name.toLowerCase()}:{' '}
              {result.galvanic.protection === 'sacrificial' ? 'sacrificial' : result.galvanic.protection === 'barrier' ? 'barrier' : 'no galvanic drive'}
            </h3>
            <p className="text-ink-muted">
              Anodic indices differ by {volts(Math.abs(result.galvanic.differenceV))} (MIL-STD-889)
              {result.galvanic.standardPotentialDifferenceV !== null
                ? `; standard potentials differ by ${volts(Math.abs(result.galvanic.standardPotentialDifferenceV))} (${STANDARD_POTENTIAL_SOURCE})`
                : ''}
              .
            </p>
            <p className="mt-1">{result.galvanic.explanation}</p>
          </div>
        ) : result ? (
          <p className="text-sm text-ink-muted">The anodic-index table has no row for this coating, so no galvanic verdict.</p>
        ) : null}

        <div className="grid gap-3 sm:grid-cols-2">
          <SelectField
            label="Touches in service"
            name="contactMaterial"
            value={form.contactMaterial}
            onChange={(e) => set({ contactMaterial: e.target.value })}
            options={[{ value: '', label: 'Nothing to check' }, ...Object.entries(GALVANIC_MATERIALS).map(([id, m]) => ({ value: id, label: m.name }))]}
          />
          <SelectField
            label="Environment"
            name="environment"
            value={form.environment}
            onChange={(e) => set({ environment: e.target.value as ServiceEnvironment })}
            options={(Object.keys(CONTACT_LIMITS_V) as ServiceEnvironment[]).map((k) => ({ value: k, label: `${ENVIRONMENT_LABELS[k]}: ≤ ${CONTACT_LIMITS_V[k]} V` }))}
          />
        </div>
        {result?.contact ? (
          <p className={result.contact.exceedsLimit ? 'text-sm font-medium text-out' : 'text-sm text-ok'} data-testid="contact-check">
            {result.contact.note}
          </p>
        ) : null}
      </div>
    </Card>
  );
}
