import { StlError } from './errors';
import { MeshAccumulator, RECORD_BYTES, VERTEX_OFFSET, type MeshTotals } from './stl-geometry';

// Streaming reader for ASCII STL. Works on bytes: a token split across chunks is carried in a
// small fixed buffer, and the free text after "solid"/"endsolid" is skipped, not stored.
//   solid name
//     facet normal nx ny nz
//       outer loop
//         vertex x y z   (three times)
//       endloop
//     endfacet
//   endsolid name
// Several solids may follow one another. Keywords are matched without regard to case.
// Coordinates are rounded to float32, the precision of binary STL, so a file gives the same
// answer in either form.

const NUMBER = 0; // placeholder in the facet pattern for a number token
const FACET: readonly (string | typeof NUMBER)[] = [
  'facet', 'normal', NUMBER, NUMBER, NUMBER, 'outer', 'loop',
  'vertex', NUMBER, NUMBER, NUMBER,
  'vertex', NUMBER, NUMBER, NUMBER,
  'vertex', NUMBER, NUMBER, NUMBER,
  'endloop', 'endfacet',
];
const NUMERIC = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const MAX_TOKEN = 128;
const FLOAT32_MAX = 3.4028234663852886e38; // coordinates are stored as float32, as in binary STL
const MAX_NAME_LINE = 4096;
const UTF8_BOM = [0xef, 0xbb, 0xbf];

type Place = 'before-solid' | 'in-solid' | 'after-solid';

function isSpace(b: number): boolean {
  return b === 32 || (b >= 9 && b <= 13);
}

export class AsciiStlReader {
  private readonly token = new Uint8Array(MAX_TOKEN);
  private tokenLength = 0;
  private skippingLine = false;
  private skipped = 0;
  private place: Place = 'before-solid';
  private step = 0; // position in FACET while inside a facet; 0 between facets
  private readonly numbers = new Float64Array(12);
  private readonly record = new DataView(new ArrayBuffer(RECORD_BYTES));
  private numberCount = 0;
  private line = 1;
  private bomSeen = 0; // bytes of a leading UTF-8 byte-order mark matched so far; −1 once past it
  private facetLine = 0;
  private readonly mesh = new MeshAccumulator();
  acceptedTokens = 0; // more than one means the text got past its "solid" line as real STL
  byteLength = 0;

  push(chunk: Uint8Array): void {
    this.byteLength += chunk.length;
    for (let i = 0; i < chunk.length; i++) {
      const b = chunk[i]!;
      if (this.bomSeen >= 0) {
        if (b === UTF8_BOM[this.bomSeen]) {
          if (++this.bomSeen === UTF8_BOM.length) this.bomSeen = -1;
          continue;
        }
        if (this.bomSeen > 0) this.fail('syntax', 'the file starts with a broken byte-order mark');
        this.bomSeen = -1;
      }
      if (this.skippingLine) {
        if (b === 10 || b === 13) this.skippingLine = false;
        else if (++this.skipped > MAX_NAME_LINE) this.fail('syntax', 'the line after "solid" is too long for an ASCII STL');
      } else if (isSpace(b)) {
        if (this.tokenLength > 0) this.endToken(b);
      } else {
        if (b < 33 || b > 126) this.fail('syntax', `byte ${b} is not printable ASCII text`);
        if (this.tokenLength === MAX_TOKEN) this.fail('syntax', 'a word is too long');
        this.token[this.tokenLength++] = b;
      }
      if (b === 10) this.line++;
    }
  }

  finish(): MeshTotals {
    if (this.tokenLength > 0) this.endToken(10);
    if (this.step > 0) {
      throw new StlError(
        'unclosed-facet',
        `The ASCII STL ends inside the facet that starts on line ${this.facetLine}; the file may be truncated.`,
      );
    }
    if (this.place !== 'after-solid') {
      throw new StlError('syntax', 'The ASCII STL ends without "endsolid"; the file may be truncated.');
    }
    if (this.mesh.triangleCount === 0) throw new StlError('empty', 'The ASCII STL contains no facets.');
    return this.mesh.totals();
  }

  private fail(code: 'syntax' | 'bad-number' | 'non-finite', what: string): never {
    throw new StlError(code, `ASCII STL, line ${this.line}: ${what}.`);
  }

  private tokenText(): string {
    return String.fromCharCode(...this.token.subarray(0, this.tokenLength));
  }

  // `terminator` is the byte that ended the token: a line end means the name line is already over.
  private endToken(terminator: number): void {
    const text = this.tokenText();
    this.tokenLength = 0;
    const word = text.toLowerCase();
    if (this.place !== 'in-solid') {
      const expected = this.place === 'before-solid' ? 'solid' : 'solid" or the end of the file';
      if (word !== 'solid') this.fail('syntax', `expected "${expected}", found "${text}"`);
      this.place = 'in-solid';
      this.acceptedTokens++;
      this.skipLine(terminator);
      return;
    }
    if (this.step === 0 && word === 'endsolid') {
      this.place = 'after-solid';
      this.acceptedTokens++;
      this.skipLine(terminator);
      return;
    }
    const expected = FACET[this.step]!;
    if (expected === NUMBER) {
      this.takeNumber(text);
    } else if (word !== expected) {
      if (this.step > 0 && (word === 'facet' || word === 'endsolid')) {
        throw new StlError(
          'unclosed-facet',
          `ASCII STL, line ${this.line}: the facet that starts on line ${this.facetLine} is not closed ` +
            `(expected "${expected}", found "${text}").`,
        );
      }
      this.fail('syntax', `expected "${expected}", found "${text}"`);
    }
    if (this.step === 0) this.facetLine = this.line;
    this.acceptedTokens++;
    if (++this.step === FACET.length) this.closeFacet();
  }

  private skipLine(terminator: number): void {
    this.skippingLine = terminator !== 10 && terminator !== 13;
    this.skipped = 0;
  }

  private takeNumber(text: string): void {
    if (!NUMERIC.test(text)) this.fail('bad-number', `"${text}" is not a number`);
    const value = Number(text);
    if (!(Math.abs(value) <= FLOAT32_MAX)) this.fail('non-finite', `"${text}" is too large for an STL coordinate`);
    this.numbers[this.numberCount++] = value;
  }

  // Packs the facet as a binary record (float32, as the binary form of STL stores it).
  private closeFacet(): void {
    for (let f = 0; f < 9; f++) {
      this.record.setFloat32(VERTEX_OFFSET + 4 * f, this.numbers[3 + f]!, true); // [0..2]: stated normal
    }
    this.mesh.addRecords(this.record, 0, 1);
    this.step = 0;
    this.numberCount = 0;
  }
}
