import { ATOMIC_WEIGHTS, isElementSymbol, type ElementSymbol } from '../chemistry/atomic-weights';
import { PlatingInputError } from './errors';

// Molar mass and metal content of salts from their formula, e.g. "NiSO4·6H2O", "KAu(CN)2",
// "Ni(SO3NH2)2·4H2O". Parentheses nest; a hydrate (or adduct) follows "·", "." or "*" with an
// optional leading count. Unicode subscript digits are accepted.

export type Composition = Map<ElementSymbol, number>;

const SUBSCRIPTS = '₀₁₂₃₄₅₆₇₈₉';

function addInto(target: Composition, source: Composition, times: number): void {
  for (const [el, n] of source) target.set(el, (target.get(el) ?? 0) + n * times);
}

// Recursive descent over one part of a formula (no "·").
class PartReader {
  private i = 0;

  constructor(
    private readonly text: string,
    private readonly fail: (why: string) => never,
  ) {}

  read(): Composition {
    const out = this.group(null);
    if (out.size === 0) this.fail('no elements');
    return out;
  }

  count(): number | null {
    const m = /^\d+/.exec(this.text.slice(this.i));
    if (!m) return null;
    this.i += m[0].length;
    const n = Number(m[0]);
    if (n === 0) this.fail('a count of 0');
    return n;
  }

  private group(closing: ')' | ']' | null): Composition {
    const out: Composition = new Map();
    while (this.i < this.text.length) {
      const ch = this.text[this.i]!;
      if (ch === ')' || ch === ']') {
        if (closing !== ch) this.fail(`unexpected "${ch}"`);
        this.i++;
        return out;
      }
      if (ch === '(' || ch === '[') {
        this.i++;
        const inner = this.group(ch === '(' ? ')' : ']');
        addInto(out, inner, this.count() ?? 1);
        continue;
      }
      const m = /^[A-Z][a-z]?/.exec(this.text.slice(this.i));
      if (!m) this.fail(`unexpected "${ch}"`);
      if (!isElementSymbol(m[0])) this.fail(`no atomic weight for element "${m[0]}"`);
      this.i += m[0].length;
      out.set(m[0], (out.get(m[0]) ?? 0) + (this.count() ?? 1));
    }
    if (closing) this.fail(`missing "${closing}"`);
    return out;
  }
}

export function parseFormula(formula: string): Composition {
  const fail = (why: string): never => {
    throw new PlatingInputError('formula', `Cannot read the formula "${formula}": ${why}.`);
  };
  const text = String(formula)
    .replace(/[₀-₉]/g, (c) => String(SUBSCRIPTS.indexOf(c)))
    .replace(/\s+/g, '');
  if (text === '') fail('it is empty');
  const total: Composition = new Map();
  for (const part of text.split(/[·.*]/)) {
    const m = /^\d+/.exec(part);
    const times = m ? Number(m[0]) : 1;
    if (times === 0) fail('a count of 0');
    addInto(total, new PartReader(m ? part.slice(m[0].length) : part, fail).read(), times);
  }
  return total;
}

export function molarMass(formula: string): number {
  let sum = 0;
  for (const [el, n] of parseFormula(formula)) sum += ATOMIC_WEIGHTS[el] * n;
  return sum;
}

// Mass fraction of one element in a compound: w = n·M_element / M_compound (reference §5).
export function massFraction(formula: string, element: string): number {
  const composition = parseFormula(formula);
  const n = isElementSymbol(element) ? composition.get(element) : undefined;
  if (!n || !isElementSymbol(element)) {
    throw new PlatingInputError('element', `The formula "${formula}" contains no ${element}.`);
  }
  return (n * ATOMIC_WEIGHTS[element]) / molarMass(formula);
}
