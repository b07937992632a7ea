import { describe, expect, it } from 'vitest';
import { cubeMesh, makeAsciiStl, makeBinaryStl, StlError } from '@/lib/plating';
import { computeCalculation } from '@/lib/estimating/calculation';
import { analyzeStlBlob, stlGeometryOf } from '@/lib/estimating/stl-file';
import { readForm } from '@/lib/estimating/form-read';
import { defaultForm } from '@/lib/estimating/form-state';

// A Blob of many small parts, so the stream hands the parser several chunks.
function blobOf(bytes: Uint8Array, parts = 7): Blob {
  const size = Math.ceil(bytes.length / parts);
  return new Blob(Array.from({ length: parts }, (_, i) => bytes.slice(i * size, (i + 1) * size)));
}

describe('analyzeStlBlob', () => {
  it('measures a 20 mm cube from a streamed file and reports progress to the end', async () => {
    const bytes = makeBinaryStl(cubeMesh(20));
    const seen: number[] = [];
    const a = (await analyzeStlBlob(blobOf(bytes), 'mm', (read, total) => {
      expect(total).toBe(bytes.length);
      seen.push(read);
    }))!;
    // Geometry by hand: area 6·20² = 2400 mm² = 0.24 dm²; volume 20³ = 8000 mm³ = 8 cm³.
    expect(a.areaDm2).toBeCloseTo(0.24, 10);
    expect(a.volumeCm3).toBeCloseTo(8, 10);
    expect(a.boundingBoxMm.size).toEqual([20, 20, 20]);
    expect(seen.at(-1)).toBe(bytes.length);
    expect(seen).toEqual([...seen].sort((x, y) => x - y));
  });

  it('reads the model in inches: a 1 in cube is 6 in² = 0.387096 dm²', async () => {
    // Source: NIST SP 811 App. B.8: 1 in² = 6.4516 cm² exactly.
    const a = (await analyzeStlBlob(blobOf(new TextEncoder().encode(makeAsciiStl(cubeMesh(1)))), 'in'))!;
    expect(a.format).toBe('ascii');
    expect(a.areaDm2).toBeCloseTo(0.387096, 10);
    expect(a.boundingBoxMm.size[0]).toBeCloseTo(25.4, 10);
  });

  it('gives the engine’s clear error for a truncated file', async () => {
    const bytes = makeBinaryStl(cubeMesh(5));
    const err = await analyzeStlBlob(blobOf(bytes.subarray(0, bytes.length - 10)), 'mm').catch((e: unknown) => e);
    expect(err).toBeInstanceOf(StlError);
    expect((err as StlError).code).toBe('truncated');
  });

  it('stops when a newer file replaces it', async () => {
    expect(await analyzeStlBlob(blobOf(makeBinaryStl(cubeMesh(5))), 'mm', undefined, () => true)).toBeNull();
  });

  it('weighs the measured part with the substrate density in the calculation', async () => {
    const a = (await analyzeStlBlob(blobOf(makeBinaryStl(cubeMesh(20))), 'mm'))!;
    const form = { ...defaultForm('metric', []), geometryMode: 'stl' as const, stl: stlGeometryOf('cube.stl', a) };
    const input = readForm(form, 'metric').input!;
    const result = computeCalculation(input);
    // 8 cm³ of carbon steel at 7.85 g/cm³ (typical handbook value, lib/plating/substrates.ts) = 62.8 g.
    expect(result.geometry.weightG).toBeCloseTo(62.8, 9);
    expect(result.estimate.areaPerPartDm2).toBeCloseTo(0.24, 10);
  });
});
