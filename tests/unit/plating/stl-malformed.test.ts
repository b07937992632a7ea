import { describe, expect, it } from 'vitest';
import {
  PlatingInputError,
  StlError,
  StlParser,
  analyzeStl,
  cubeMesh,
  makeAsciiStl,
  makeBinaryStl,
  type StlErrorCode,
} from '@/lib/plating';
import { catchError } from './catch-error';
import { encode } from './stl-helpers';

// Every malformed file is refused with an StlError naming what is wrong.

function refusal(bytes: Uint8Array): StlError {
  const err = catchError(() => analyzeStl(bytes));
  expect(err).toBeInstanceOf(StlError);
  expect(err.message.length).toBeGreaterThan(15);
  return err as StlError;
}

const expectCode = (bytes: Uint8Array, code: StlErrorCode) => expect(refusal(bytes).code).toBe(code);

const cube = () => makeBinaryStl(cubeMesh(10));
const cubeText = () => makeAsciiStl(cubeMesh(10), 'cube');
const withCount = (bytes: Uint8Array, n: number) => {
  const copy = bytes.slice();
  new DataView(copy.buffer).setUint32(80, n, true);
  return copy;
};
const withFloat = (bytes: Uint8Array, at: number, value: number) => {
  const copy = bytes.slice();
  new DataView(copy.buffer).setFloat32(at, value, true);
  return copy;
};

describe('binary STL refusals', () => {
  it('empty file', () => expectCode(new Uint8Array(0), 'empty'));

  it('a header with zero triangles', () => expectCode(withCount(cube().subarray(0, 84), 0), 'empty'));

  it('shorter than the 84-byte header', () => expectCode(new Uint8Array(60).fill(7), 'truncated'));

  it('truncated in the middle of a triangle', () => {
    const bytes = cube();
    const err = refusal(bytes.subarray(0, bytes.length - 10));
    expect(err.code).toBe('truncated');
    expect(err.message).toMatch(/12 triangles/);
  });

  it('header count larger than the records present', () => expectCode(withCount(cube(), 13), 'truncated'));

  it('header count smaller than the records present', () => expectCode(withCount(cube(), 11), 'count-mismatch'));

  it('trailing bytes after the last record', () => {
    const bytes = cube();
    const longer = new Uint8Array(bytes.length + 7);
    longer.set(bytes);
    expectCode(longer, 'count-mismatch');
  });

  it.each([Number.NaN, Infinity, -Infinity])('a %d coordinate', (bad) => {
    // Third triangle, second vertex, y: 84 + 2·50 + 12 (normal) + 12 (first vertex) + 4.
    const err = refusal(withFloat(cube(), 84 + 100 + 28, bad));
    expect(err.code).toBe('non-finite');
    expect(err.message).toMatch(/Triangle 3/);
  });

  it('a header beginning with "solid" does not rescue a broken binary', () => {
    const bytes = makeBinaryStl(cubeMesh(10), 'solid cube');
    expectCode(bytes.subarray(0, bytes.length - 1), 'truncated');
  });
});

describe('ASCII STL refusals', () => {
  const facetBlock = (v: string) =>
    `solid t\n facet normal 0 0 1\n  outer loop\n   vertex 0 0 0\n   vertex 1 0 0\n   vertex ${v}\n  endloop\n endfacet\nendsolid t\n`;

  it.each(['0 abc 0', '0 1.0.0 0', '0 nan 0', '0 inf 0', '0 0x10 0', '0 1e 0'])('bad number in "vertex %s"', (v) => {
    const err = refusal(encode(facetBlock(v)));
    expect(err.code).toBe('bad-number');
    expect(err.message).toMatch(/line 6/);
  });

  it('a number too large for a coordinate', () => expectCode(encode(facetBlock('0 1e999 0')), 'non-finite'));

  it('coordinates so large the area overflows', () => expectCode(encode(facetBlock('0 1e300 1e300').replace('vertex 1 0 0', 'vertex 1e300 0 0')), 'non-finite'));

  it('ends inside a facet', () => {
    const text = cubeText();
    const cut = text.slice(0, text.lastIndexOf('endloop'));
    const err = refusal(encode(cut));
    expect(err.code).toBe('unclosed-facet');
    expect(err.message).toMatch(/line \d+/);
  });

  it('a facet opened before the previous one closed', () => {
    const text = cubeText().replace('endloop\n  endfacet\n  facet', 'endloop\n  facet');
    expectCode(encode(text), 'unclosed-facet');
  });

  it('missing "endsolid"', () => expectCode(encode(cubeText().replace(/endsolid cube\n$/, '')), 'syntax'));

  it('a missing keyword', () => expectCode(encode(cubeText().replace('outer loop', 'outer')), 'syntax'));

  it('a fourth vertex', () => expectCode(encode(facetBlock('0 1 0\n vertex 1 1 1')), 'syntax'));

  it('a solid with no facets', () => expectCode(encode('solid nothing\nendsolid nothing\n'), 'empty'));

  it('binary bytes inside text', () => expectCode(encode(facetBlock('0 1 0').replace('endloop', 'end\u0001loop')), 'syntax'));
});

describe('parser use', () => {
  it('refuses use after finish', () => {
    const p = new StlParser();
    p.push(cube());
    p.finish();
    expect(catchError(() => p.push(cube()))).toMatchObject({ code: 'state' });
    expect(catchError(() => p.finish())).toMatchObject({ code: 'state' });
  });

  it('refuses bad options as input errors', () => {
    expect(catchError(() => new StlParser({ unit: 'cm' as 'mm' }))).toMatchObject({ field: 'unit' });
    expect(() => new StlParser({ densityGPerCm3: -1 })).toThrow(PlatingInputError);
  });

  it('fails early on a broken binary instead of reading on', () => {
    const p = new StlParser();
    const bytes = withCount(cube(), 1);
    expect(catchError(() => p.push(bytes))).toMatchObject({ code: 'count-mismatch' });
  });
});
