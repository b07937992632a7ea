// Chemical formula parsing and molar masses for plating salts. Pure: no I/O.
// Atomic weights come from ./atomic-weights (IUPAC/CIAAW); nothing here restates them.
import { ATOMIC_WEIGHTS, isElementSymbol, type ElementSymbol } from './atomic-weights';
import { AppError } from '../errors';

export type ElementCounts = Partial<Record<ElementSymbol, number>>;

// Thrown for any formula we cannot read; carries the character position so a form can point at it.
export class FormulaError extends AppError {
  readonly position: number;
  constructor(formula: string, position: number, detail: string) {
    const message = `Cannot read the formula "${formula}" at character ${position + 1}: ${detail}`;
    super('BAD_INPUT', message, { formula: [message] });
    this.name = 'FormulaError';
    this.position = position;
  }
}

// Hydrate and adduct separators seen on labels and data sheets: middle dot, bullet, asterisk,
// and the plain full stop that keyboards produce (NiSO4.6H2O).
const SEPARATORS = new Set(['·', '•', '∙', '⋅', '*', '.']);
const SUBSCRIPT_DIGITS = '₀₁₂₃₄₅₆₇₈₉';
const OPEN_TO_CLOSE: Record<string, string> = { '(': ')', '[': ']' };

// Subscript digits (NiSO₄·6H₂O) are folded to ASCII so both spellings read the same.
function normalise(formula: string): string {
  let out = '';
  for (const ch of formula.trim()) {
    const sub = SUBSCRIPT_DIGITS.indexOf(ch);
    out += sub >= 0 ? String(sub) : ch;
  }
  return out;
}

function addCounts(into: ElementCounts, from: ElementCounts, times: number): void {
  for (const [el, n] of Object.entries(from) as [ElementSymbol, number][]) {
    into[el] = (into[el] ?? 0) + n * times;
  }
}

class Parser {
  private pos = 0;
  constructor(
    private readonly text: string,
    private readonly original: string,
  ) {}

  parse(): ElementCounts {
    if (this.text.length === 0) throw new FormulaError(this.original, 0, 'the formula is empty');
    const total: ElementCounts = {};
    for (;;) {
      const coefficient = this.readNumber(true) ?? 1;
      if (coefficient <= 0) this.fail('a hydrate coefficient must be greater than zero');
      const part = this.readSequence(null);
      if (Object.keys(part).length === 0) this.fail('expected an element symbol');
      addCounts(total, part, coefficient);
      if (this.pos >= this.text.length) return total;
      const ch = this.text[this.pos] as string;
      if (!SEPARATORS.has(ch)) this.fail(`unexpected "${ch}"`);
      this.pos += 1;
    }
  }

  // Reads elements and bracketed groups until a separator, the end, or the expected closer.
  private readSequence(closer: string | null): ElementCounts {
    const counts: ElementCounts = {};
    while (this.pos < this.text.length) {
      const ch = this.text[this.pos] as string;
      if (closer !== null && ch === closer) return counts;
      if (SEPARATORS.has(ch) && closer === null) return counts;
      if (ch in OPEN_TO_CLOSE) {
        const close = OPEN_TO_CLOSE[ch] as string;
        const openedAt = this.pos;
        this.pos += 1;
        const inner = this.readSequence(close);
        if (this.text[this.pos] !== close) {
          this.pos = openedAt;
          this.fail(`"${ch}" is never closed`);
        }
        if (Object.keys(inner).length === 0) this.fail('empty brackets');
        this.pos += 1;
        addCounts(counts, inner, this.readNumber(false) ?? 1);
        continue;
      }
      if (ch >= 'A' && ch <= 'Z') {
        const start = this.pos;
        this.pos += 1;
        while (this.pos < this.text.length && /[a-z]/.test(this.text[this.pos] as string)) this.pos += 1;
        const symbol = this.text.slice(start, this.pos);
        if (!isElementSymbol(symbol)) {
          this.pos = start;
          this.fail(`"${symbol}" is not an element this app knows`);
        }
        const n = this.readNumber(false) ?? 1;
        if (n === 0) this.fail('a subscript of 0 is not allowed');
        counts[symbol] = (counts[symbol] ?? 0) + n;
        continue;
      }
      if (closer === null && (ch === ')' || ch === ']')) this.fail(`"${ch}" has no opening bracket`);
      this.fail(`unexpected "${ch}"`);
    }
    return counts;
  }

  // Subscripts are whole numbers; a hydrate coefficient may be decimal (CaSO4·0.5H2O).
  private readNumber(allowDecimal: boolean): number | null {
    const rest = this.text.slice(this.pos);
    const match = (allowDecimal ? /^\d+(\.\d+)?(?=[A-Z([])/ : /^\d+/).exec(rest);
    if (!match) return null;
    this.pos += match[0].length;
    return Number(match[0]);
  }

  private fail(detail: string): never {
    throw new FormulaError(this.original, this.pos, detail);
  }
}

/** Element counts of a formula such as `Ni(SO3NH2)2·4H2O` or `NiSO4.6H2O`. */
export function parseFormula(formula: string): ElementCounts {
  if (typeof formula !== 'string') throw new FormulaError(String(formula), 0, 'the formula must be text');
  return new Parser(normalise(formula), formula).parse();
}

/** Molar mass in g/mol from IUPAC standard atomic weights. */
export function molarMass(formula: string): number {
  let total = 0;
  for (const [el, n] of Object.entries(parseFormula(formula)) as [ElementSymbol, number][]) {
    total += ATOMIC_WEIGHTS[el] * n;
  }
  return total;
}

/** Mass fraction (0–1) of one element in a compound, e.g. Ni in NiSO4·6H2O ≈ 0.2233. */
export function metalFraction(formula: string, element: ElementSymbol | string): number {
  if (!isElementSymbol(element)) {
    throw new AppError('BAD_INPUT', `"${element}" is not an element this app knows`, {
      element: [`Unknown element "${element}"`],
    });
  }
  const counts = parseFormula(formula);
  const n = counts[element];
  if (!n) {
    const message = `${formula} contains no ${element}`;
    throw new AppError('BAD_INPUT', message, { element: [message] });
  }
  return (ATOMIC_WEIGHTS[element] * n) / molarMass(formula);
}
