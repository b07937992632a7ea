import { Caution, type CautionKind } from '../ui/caution';
import { HAZARD_CAUTIONS, type Hazard } from '@/lib/bath/hazards';

// The bath template's hazard tags as the UI's standard cautions; the two without a standard
// caution (nickel, oxidiser) are added in the template's own words.
const KIND: Partial<Record<Hazard, CautionKind>> = {
  cyanide: 'cyanide',
  hexavalent_chromium: 'hexavalent-chromium',
  strong_acid: 'acid',
  caustic: 'caustic',
  hydrogen: 'hydrogen',
  heat: 'heat',
  electrical: 'electrical',
};

export function BathCaution({ hazards, compact, className }: { hazards: readonly Hazard[]; compact?: boolean; className?: string }) {
  const kinds = hazards.map((h) => KIND[h]).filter((k): k is CautionKind => !!k);
  const extra = hazards.filter((h) => !KIND[h]).map((h) => HAZARD_CAUTIONS[h]);
  // Every template carries at least one standard hazard; none means nothing to show.
  if (kinds.length === 0) return null;
  return (
    <Caution kind={kinds} compact={compact} className={className}>
      {!compact && extra.length ? extra.map((t) => <p key={t}>{t}</p>) : null}
    </Caution>
  );
}
