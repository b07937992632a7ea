import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { BathCaution } from '@/components/bath/bath-caution';
import { formatBathValue } from '@/components/bath/bath-value';
import { LinkButton } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { can, requirePageUser } from '@/lib/auth/current-user';
import { ALERT_KIND_LABEL, findAlerts } from '@/lib/bath/alerts';
import { doseRows } from '@/lib/bath/dose-rows';
import { findAdditiveDoses, findHullCellPanels, findRecentAdditions, findRecentAnalyses } from '@/lib/bath/history';
import { findLimitChanges } from '@/lib/bath/limits';
import { findAnalyteStatus, getTank } from '@/lib/bath/queries';
import { readSupply } from '@/lib/bath/templates/supplies';
import { getTemplate } from '@/lib/bath/templates';
import { findBathAges } from '@/lib/bath/bath-age';
import { formatWhen } from '@/lib/bath/display';
import { familyOfTemplate, getFamily } from '@/lib/families';
import { familyFieldText } from '@/lib/families/form';
import { AnalytesTable } from './analytes-table';
import { DecantCalculator, ProcessSettingsForm } from './process-settings';
import { SetupAnalytesForm } from './setup-form';
import { AdditionsTable, AnalysesTable } from './tank-records';
import { TankSide } from './tank-side';

export const metadata: Metadata = { title: 'Tank' };

export default async function BathTankPage({ params }: { params: Promise<{ tankId: string }> }) {
  const { tankId } = await params;
  const user = await requirePageUser('bath.read', `/baths/${tankId}`);
  const tank = await getTank({ id: tankId });
  if (!tank) notFound();
  const template = getTemplate(tank.template_id);
  const [analytes, analyses, additions, doses, panels, alerts] = await Promise.all([
    findAnalyteStatus([tank.id]),
    findRecentAnalyses(tank.id, { limit: 40 }),
    findRecentAdditions(tank.id, 20),
    tank.has_ah_meter ? findAdditiveDoses(tank.id) : Promise.resolve({ doses: [], lastReading: null }),
    findHullCellPanels(tank.id, 6),
    findAlerts({ open: true, tankId: tank.id }),
  ]);
  const [changes, ages] = await Promise.all([findLimitChanges(analytes.map((a) => a.id)), findBathAges([tank.id])]);
  const age = ages.get(tank.id) ?? null;
  const family = getFamily(familyOfTemplate(tank.template_id));
  const aluminium = analytes.find((a) => a.key === 'aluminium');
  const acid = analytes.find((a) => a.key === 'sulfuricAcid');
  const system = user.unitSystem;
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow={<Link href="/baths" className="text-action underline">Baths</Link>}
        title={`${tank.code} · ${tank.name}`}
        description={`${template?.name ?? tank.template_id} · ${formatBathValue(tank.volume_l, 'L', system)} · ${tank.line_name}${tank.rectifier_max_a ? ` · rectifier ${tank.rectifier_max_a} A` : ''} · ${tank.anode_type} anodes`}
        actions={
          <>
            {can(user, 'bath.log') ? <LinkButton href={`/floor/tanks/${tank.code}`}>Log at the tank</LinkButton> : null}
            {can(user, 'bath.log') ? <LinkButton href={`/floor/tanks/${tank.code}/label`} variant="secondary">QR label</LinkButton> : null}
          </>
        }
      />
      <BathCaution hazards={template?.hazards ?? []} compact />
      {alerts.length > 0 ? (
        <Card title={`Open alerts (${alerts.length})`} actions={<Link href="/baths/alerts" className="text-sm text-action underline">All alerts</Link>}>
          <ul className="flex flex-col gap-1 text-sm">
            {alerts.map((a) => (
              <li key={a.id}>
                <strong>{ALERT_KIND_LABEL[a.kind]}</strong>
                {a.state === 'escalated' ? ' (escalated)' : ''}: {a.message}
              </li>
            ))}
          </ul>
        </Card>
      ) : null}
      {age ? (
        <Card title="Bath age">
          <p className={`text-lg ${age.atEndOfLife ? 'font-semibold text-out' : ''}`}>
            {age.atEndOfLife ? '▲ At the end of its life: ' : ''}
            {age.text}
          </p>
          <p className="text-sm text-ink-muted">Counted from the nickel replenished since the bath was made up{tank.made_up_at ? ` on ${formatWhen(tank.made_up_at)}` : ''}.</p>
        </Card>
      ) : null}
      {aluminium && acid ? (
        <Card title="Decant and refill for aluminium">
          <DecantCalculator volumeL={tank.volume_l} aluminiumGPerL={aluminium.last_value ?? null} acidTargetGPerL={acid.target} aluminiumLimitGPerL={aluminium.upper_control ?? 15} />
        </Card>
      ) : null}
      {family.tankSettings ? (
        <Card title="Process settings" description={`What this ${family.label.toLowerCase()} tank keeps besides its chemistry.`}>
          <ProcessSettingsForm
            tankId={tank.id}
            fields={family.tankSettings.fields}
            values={Object.fromEntries(family.tankSettings.fields.map((f) => [f.name, familyFieldText(f, tank.family_settings[f.name] ?? (family.tankSettings!.schema.safeParse({}).data as Record<string, unknown> | undefined)?.[f.name], system)]))}
            madeUpOn={tank.made_up_at ? tank.made_up_at.toISOString().slice(0, 10) : ''}
            readOnly={!can(user, 'bath.limits')}
          />
        </Card>
      ) : null}
      <Card title="Analytes" padding="sm">
        {analytes.length === 0 ? (
          <EmptyState
            title="No analytes set up"
            description="Copy the analytes, limits and methods from the tank's bath template."
            action={can(user, 'bath.limits') ? <SetupAnalytesForm tankId={tank.id} /> : null}
          />
        ) : (
          <AnalytesTable tankId={tank.id} analytes={analytes} system={system} canEditLimits={can(user, 'bath.limits')} />
        )}
      </Card>
      <Card title="Recent analyses" description="Corrections are new entries: the corrected one stays, struck through." padding="sm">
        <AnalysesTable rows={analyses} tankCode={tank.code} system={system} canCorrect={can(user, 'bath.log')} />
      </Card>
      <Card title="Recent additions" padding="sm">
        <AdditionsTable rows={additions} system={system} />
      </Card>
      <TankSide
        system={system}
        doses={doseRows(doses.doses, analytes.map((a) => ({ id: a.id, supply: readSupply(a.supply) })))}
        lastReading={doses.lastReading}
        panels={panels}
        changes={changes}
        analyteNames={new Map(analytes.map((a) => [a.id, a.name]))}
      />
    </div>
  );
}
