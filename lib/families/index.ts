// The process families, registered once. The rest of the app asks here: which family a finish or
// a bath template belongs to, how a line is priced, what a lot must record, what the certificate
// says. Adding a family is a folder beside this file and one line below.
import type { ProcessFamilyId } from '@/db/types';
import { PlatingInputError } from '@/lib/plating';
import type { LinePrice, PricingInput } from '@/lib/quotes/pricing';
import { anodizing } from './anodizing';
import { electrolessNickel } from './electroless-nickel';
import { electroplating } from './electroplating';
import { passivation } from './passivation';
import type { ProcessFamily } from './types';

export type { ProcessFamily, ProcessFamilyId, QualityRequirement } from './types';

export const FAMILIES: readonly ProcessFamily<never>[] = [electroplating, electrolessNickel, anodizing, passivation] as unknown as ProcessFamily<never>[];

export const FAMILY_IDS = FAMILIES.map((f) => f.id) as [ProcessFamilyId, ...ProcessFamilyId[]];

export function getFamily(id: ProcessFamilyId | undefined): ProcessFamily<Record<string, unknown>> {
  const family = FAMILIES.find((f) => f.id === (id ?? 'electroplating'));
  if (!family) throw new PlatingInputError('family', `There is no process family "${String(id)}".`);
  return family as unknown as ProcessFamily<Record<string, unknown>>;
}

/** The family a bath template belongs to; pretreatment tanks count with electroplating. */
export function familyOfTemplate(templateId: string): ProcessFamilyId {
  return FAMILIES.find((f) => f.templates.some((t) => t.id === templateId))?.id ?? 'electroplating';
}

/** A finish's family figures, read through the family's schema; a field error names the figure. */
export function familyParams(id: ProcessFamilyId | undefined, raw: unknown): Record<string, unknown> {
  const family = getFamily(id);
  const parsed = family.paramsSchema.safeParse(raw ?? {});
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!;
    throw new PlatingInputError(String(issue.path[0] ?? 'familyParams'), `${family.label}: ${issue.message}`);
  }
  return parsed.data;
}

/** One line's price by its finish's family. */
export function priceFinishLine(input: PricingInput): LinePrice {
  const family = getFamily(input.finish.family);
  return family.price(input, familyParams(family.id, input.finish.familyParams));
}
