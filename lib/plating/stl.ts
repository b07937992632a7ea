import { PlatingInputError, StlError } from './errors';
import { AsciiStlReader } from './stl-ascii';
import { BINARY_HEADER_BYTES, BinaryStlReader } from './stl-binary';
import type { MeshTotals, Vec3 } from './stl-geometry';
import { requirePositive } from './validate';

// Streaming STL analysis: push chunks as they arrive (upload, file stream), then finish().
// Memory stays O(1) whatever the file size: nothing per triangle is kept.
//
// Telling binary from ASCII: text that begins with "solid" may still be binary, because many
// exporters write "solid …" into the binary header. Such a file is read both ways at once; at the
// end a binary reading whose size is exactly 84 + 50·n wins, otherwise the ASCII reading (which
// needs "facet" records and "endsolid") is taken. Anything not starting with "solid" is binary.

export type StlUnit = 'mm' | 'in';
export type StlOptions = { unit?: StlUnit; densityGPerCm3?: number };

export type StlAnalysis = {
  format: 'binary' | 'ascii';
  unit: StlUnit;
  byteLength: number;
  triangleCount: number;
  areaDm2: number;
  // Positive when the facets face outwards. Only meaningful for a closed (watertight) mesh.
  signedVolumeCm3: number;
  volumeCm3: number;
  boundingBoxMm: { min: Vec3; max: Vec3; size: Vec3 };
  weightG: number | null; // |volume| × density, when a density was given
};

const MM_PER_UNIT: Record<StlUnit, number> = { mm: 1, in: 25.4 }; // NIST SP 811: 1 in = 25.4 mm
const MM2_PER_DM2 = 1e4;
const MM3_PER_CM3 = 1e3;
const UTF8_BOM = [0xef, 0xbb, 0xbf];

function startsWithSolid(bytes: Uint8Array): boolean {
  let i = 0;
  if (UTF8_BOM.every((b, k) => bytes[k] === b)) i = 3;
  while (i < bytes.length && (bytes[i] === 32 || (bytes[i]! >= 9 && bytes[i]! <= 13))) i++;
  const word = String.fromCharCode(...bytes.subarray(i, i + 5)).toLowerCase();
  const after = bytes[i + 5];
  return word === 'solid' && (after === undefined || after === 32 || (after >= 9 && after <= 13));
}

export class StlParser {
  private readonly unit: StlUnit;
  private readonly density: number | null;
  private readonly sniff = new Uint8Array(BINARY_HEADER_BYTES);
  private sniffLength = 0;
  private decided = false;
  private finished = false;
  private binary: BinaryStlReader | null = new BinaryStlReader();
  private ascii: AsciiStlReader | null = null;
  private binaryError: StlError | null = null;
  private asciiError: StlError | null = null;
  private asciiProgress = 0;
  private byteLength = 0;

  constructor(options: StlOptions = {}) {
    const unit = options.unit ?? 'mm';
    if (unit !== 'mm' && unit !== 'in') {
      throw new PlatingInputError('unit', `STL unit must be "mm" or "in"; got "${String(unit)}".`);
    }
    this.unit = unit;
    this.density =
      options.densityGPerCm3 === undefined
        ? null
        : requirePositive('densityGPerCm3', 'Density (g/cm³)', options.densityGPerCm3);
  }

  push(chunk: Uint8Array): void {
    if (this.finished) throw new StlError('state', 'This STL parser has already finished.');
    this.byteLength += chunk.length;
    if (this.decided) return this.feed(chunk);

    const take = Math.min(BINARY_HEADER_BYTES - this.sniffLength, chunk.length);
    this.sniff.set(chunk.subarray(0, take), this.sniffLength);
    this.sniffLength += take;
    if (this.sniffLength < BINARY_HEADER_BYTES) return;
    this.decide();
    if (take < chunk.length) this.feed(chunk.subarray(take));
  }

  finish(): StlAnalysis {
    if (this.finished) throw new StlError('state', 'This STL parser has already finished.');
    this.finished = true;
    if (this.byteLength === 0) throw new StlError('empty', 'The file is empty.');
    if (!this.decided) this.decide();

    const binary = this.finishReader('binary');
    if (binary) return this.result('binary', binary);
    const ascii = this.finishReader('ascii');
    if (ascii) return this.result('ascii', ascii);
    throw this.pickError();
  }

  private decide(): void {
    this.decided = true;
    const head = this.sniff.subarray(0, this.sniffLength);
    if (startsWithSolid(head)) this.ascii = new AsciiStlReader();
    this.feed(head);
  }

  private feed(chunk: Uint8Array): void {
    if (this.binary) {
      try {
        this.binary.push(chunk);
      } catch (e) {
        this.binaryError = asStlError(e);
        this.binary = null;
      }
    }
    if (this.ascii) {
      try {
        this.ascii.push(chunk);
      } catch (e) {
        this.asciiError = asStlError(e);
        this.asciiProgress = this.ascii.acceptedTokens;
        this.ascii = null;
      }
    }
    if (!this.binary && !this.ascii) throw this.pickError();
  }

  private finishReader(kind: 'binary' | 'ascii'): MeshTotals | null {
    const reader = kind === 'binary' ? this.binary : this.ascii;
    if (!reader) return null;
    try {
      return reader.finish();
    } catch (e) {
      if (kind === 'binary') {
        this.binaryError = asStlError(e);
      } else {
        this.asciiError = asStlError(e);
        this.asciiProgress = (reader as AsciiStlReader).acceptedTokens;
      }
      return null;
    }
  }

  // When both readings fail, report the one the file was evidently meant to be: ASCII if the text
  // got past its "solid" line as STL keywords, binary otherwise.
  private pickError(): StlError {
    if (this.asciiError && (this.asciiProgress > 1 || !this.binaryError)) {
      return this.asciiError;
    }
    return this.binaryError ?? new StlError('not-stl', 'The file is not a readable STL.');
  }

  private result(format: 'binary' | 'ascii', totals: MeshTotals): StlAnalysis {
    const s = MM_PER_UNIT[this.unit];
    const scale = (v: Vec3): Vec3 => [v[0] * s, v[1] * s, v[2] * s];
    const min = scale(totals.min);
    const max = scale(totals.max);
    const areaDm2 = (totals.areaMm2 * s * s) / MM2_PER_DM2;
    const signedVolumeCm3 = (totals.signedVolumeMm3 * s * s * s) / MM3_PER_CM3;
    if (!Number.isFinite(areaDm2) || !Number.isFinite(signedVolumeCm3)) {
      throw new StlError('non-finite', 'The coordinates are too large to compute an area or volume.');
    }
    const volumeCm3 = Math.abs(signedVolumeCm3);
    return {
      format,
      unit: this.unit,
      byteLength: this.byteLength,
      triangleCount: totals.triangleCount,
      areaDm2,
      signedVolumeCm3,
      volumeCm3,
      boundingBoxMm: { min, max, size: [max[0] - min[0], max[1] - min[1], max[2] - min[2]] },
      weightG: this.density === null ? null : volumeCm3 * this.density,
    };
  }
}

function asStlError(e: unknown): StlError {
  if (e instanceof StlError) return e;
  throw e; // a bug, not bad input: let it surface
}

export function analyzeStl(bytes: Uint8Array, options: StlOptions = {}): StlAnalysis {
  const parser = new StlParser(options);
  parser.push(bytes);
  return parser.finish();
}
