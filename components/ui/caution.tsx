import type { ReactNode } from 'react';
import { cx } from './cx';

export type CautionKind =
  | 'cyanide'
  | 'hexavalent-chromium'
  | 'acid'
  | 'caustic'
  | 'hydrogen'
  | 'electrical'
  | 'high-strength-steel-bake'
  | 'heat'
  | 'nickel'
  | 'nitric-acid';

export const SAFETY_DEFERRAL =
  "Follow the safety data sheet, the customer's specification, local codes and licensed practice.";

// Short reminders, not instructions: the SDS, the specification and local rules govern.
// Summarised from the project's plating reference, §12 (hazards) and §7 (embrittlement relief).
export const cautionTexts: Record<CautionKind, { title: string; text: string }> = {
  cyanide: {
    title: 'Cyanide',
    text:
      'Cyanide solutions and rinses give off deadly hydrogen cyanide gas if they meet acid. Keep cyanide and acid ' +
      'tanks, drains and spills apart, keep the bath alkaline, and know where the emergency kit and plan are.',
  },
  // Carcinogen; US limit 5 µg/m³ as an 8-hour average (Source: OSHA 29 CFR 1910.1026).
  'hexavalent-chromium': {
    title: 'Hexavalent chromium',
    text:
      'A carcinogen with a very low exposure limit. Keep mist control and ventilation running, wear the specified ' +
      'protection, and do not eat, drink or smoke in the plating area.',
  },
  acid: {
    title: 'Strong acid',
    text:
      'Burns skin and eyes. Wear a face shield, gloves and apron; add acid to water, never water to acid; keep an ' +
      'eyewash and safety shower within reach.',
  },
  caustic: {
    title: 'Caustic (strong alkali)',
    text:
      'Burns skin and eyes and gets hot as it dissolves. Wear a face shield, gloves and apron; add it slowly to water ' +
      'while stirring; keep an eyewash and safety shower within reach.',
  },
  hydrogen: {
    title: 'Hydrogen',
    text:
      'Plating, pickling and cathodic cleaning give off hydrogen, which can gather under covers and in barrels. Keep ' +
      'ventilation running and sparks and flames away from tanks and bus bars.',
  },
  electrical: {
    title: 'Electrical',
    text:
      'Rectifier output is low voltage but very high current: a short across bus bars or racks burns and arcs, and ' +
      'the supply side can kill. Take off rings and watches; lock out and tag out before working on a rectifier.',
  },
  // Relief applies from about 1000 MPa / 31 HRC (Source: ASTM B849 scope, B850 Table 1); bake before any
  // conversion coating (Source: ASTM B850); start commonly within 4 h (Source: ASTM F1941 summary).
  'high-strength-steel-bake': {
    title: 'High-strength steel: embrittlement relief bake',
    text:
      'Steel of about 31 HRC (1000 MPa) and harder can crack from hydrogen taken up in plating. Bake as the ' +
      'specification requires, usually starting within 4 hours of plating and before any passivate or chromate. ' +
      'The bake lowers the risk; it does not remove it.',
  },
  nickel: {
    title: 'Nickel salts',
    text:
      'Nickel compounds sensitise skin and lungs, and some cause cancer. Wear gloves, keep mist down, wash before ' +
      'eating, and keep nickel solutions out of drains.',
  },
  'nitric-acid': {
    title: 'Nitric acid',
    text:
      'Gives off brown nitrogen-oxide fumes and is a strong oxidiser: keep the tank under extraction, away from ' +
      'solvents, oils and other organics, and never mix it with them.',
  },
  heat: {
    title: 'Hot solutions and surfaces',
    text:
      'Heated tanks, immersion heaters and ovens scald and burn. Wear heat-resistant gloves, let parts cool before ' +
      'handling, and keep heaters covered by solution.',
  },
};

export type CautionProps = {
  /** One hazard or several; each gets its short standard text. */
  kind: CautionKind | readonly CautionKind[];
  /** Titles only, for tight spaces; the deferral line is always shown. */
  compact?: boolean;
  /** Extra, screen-specific words (e.g. the tank's own rule). */
  children?: ReactNode;
  className?: string;
};

/** A safety callout. It always ends with the deferral to the SDS, the specification, codes and practice. */
export function Caution({ kind, compact = false, children, className }: CautionProps) {
  const kinds: readonly CautionKind[] = typeof kind === 'string' ? [kind] : kind;
  const titles = kinds.map((k) => cautionTexts[k].title);
  return (
    <div
      role="note"
      aria-label={`Safety caution: ${titles.join(', ')}`}
      className={cx('flex gap-3 rounded-md border border-near/30 border-l-4 border-l-near bg-near-soft px-3 py-2.5 text-sm text-ink', className)}
    >
      <CautionIcon />
      <div className="flex min-w-0 flex-col gap-1.5">
        {compact ? (
          <p className="font-semibold">Caution: {titles.join(' · ')}</p>
        ) : (
          kinds.map((k) => (
            <p key={k}>
              <strong className="font-semibold">{cautionTexts[k].title}.</strong> {cautionTexts[k].text}
            </p>
          ))
        )}
        {children ? <div>{children}</div> : null}
        <p className="text-ink-muted">{SAFETY_DEFERRAL}</p>
      </div>
    </div>
  );
}

// A hexagon with an exclamation mark, kept distinct from the filled triangle that means "out of range".
function CautionIcon() {
  return (
    <svg viewBox="0 0 20 20" className="mt-0.5 size-5 shrink-0 text-near" aria-hidden="true" focusable="false">
      <path d="M10 1.5 17.4 5.75v8.5L10 18.5 2.6 14.25v-8.5Z" fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinejoin="round" />
      <path d="M10 5.6v5.6" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
      <circle cx="10" cy="14.2" r="1.2" fill="currentColor" />
    </svg>
  );
}
