import { Caution } from '../ui/caution';
import { cautionKindsOf, HAZARD_CAUTIONS, type Hazard } from '@/lib/bath/hazards';

// The bath template's hazard tags as the UI's standard cautions; a tag without one (oxidiser) is
// added in the template's own words.
export function BathCaution({ hazards, compact, className }: { hazards: readonly Hazard[]; compact?: boolean; className?: string }) {
  const kinds = cautionKindsOf(hazards);
  const extra = hazards.filter((h) => cautionKindsOf([h]).length === 0).map((h) => HAZARD_CAUTIONS[h]);
  // Every template carries at least one standard hazard; none means nothing to show.
  if (kinds.length === 0) return null;
  return (
    <Caution kind={kinds} compact={compact} className={className}>
      {!compact && extra.length ? extra.map((t) => <p key={t}>{t}</p>) : null}
    </Caution>
  );
}
