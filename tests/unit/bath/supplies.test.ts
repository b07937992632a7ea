import { describe, expect, it } from 'vitest';
import { planCorrection } from '@/lib/bath/additions';
import { readSupply, supplyMaterial, TEMPLATE_SUPPLIES } from '@/lib/bath/templates/supplies';
import { getTemplate } from '@/lib/bath/templates';

describe('template supplies', () => {
  it('name only analytes the template has, and materials that exist', () => {
    for (const [templateId, map] of Object.entries(TEMPLATE_SUPPLIES)) {
      const t = getTemplate(templateId);
      expect(t, templateId).not.toBeNull();
      for (const [key, supply] of Object.entries(map)) {
        const a = t!.analytes.find((x) => x.key === key);
        expect(a, `${templateId}/${key}`).toBeDefined();
        expect(readSupply(JSON.parse(JSON.stringify(supply))), `${templateId}/${key}`).toEqual(supply);
        expect(supplyMaterial(supply).length).toBeGreaterThan(2);
        // Additives are dosed in mL/L; everything else is a concentration in g/L.
        expect(a!.unit, `${templateId}/${key}`).toBe(supply.kind === 'additive' ? 'mL/L' : 'g/L');
        if (supply.kind !== 'additive') {
          const plan = planCorrection({ volumeL: 1000, components: [{ key, name: a!.name, measured: a!.target * 0.8, target: a!.target, supply }] });
          expect(plan.additions[0]!.amount, `${templateId}/${key}`).toBeGreaterThan(0);
        }
      }
    }
  });

  it('refuses stored shapes it does not know', () => {
    expect(readSupply({ kind: 'salt', saltId: 'no-such-salt' })).toBeNull();
    expect(readSupply({ kind: 'as_measured', name: '  ' })).toBeNull();
    expect(readSupply('salt')).toBeNull();
  });
});
