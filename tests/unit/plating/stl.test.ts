import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  analyzeStl,
  cubeMesh,
  cylinderMesh,
  makeAsciiStl,
  makeBinaryStl,
  meshOf,
  uvSphereMesh,
  type Triangle,
} from '@/lib/plating';
import { encode, float32Mesh, parseInChunks, rel } from './stl-helpers';

// STL analysis against analytic values for generated meshes.

describe('analytic meshes', () => {
  it('cube of 10 mm: exactly 600 mm², 1000 mm³, 12 triangles', () => {
    const r = analyzeStl(makeBinaryStl(cubeMesh(10)));
    expect(r.format).toBe('binary');
    expect(r.triangleCount).toBe(12);
    expect(r.areaDm2).toBe(0.06);
    expect(r.signedVolumeCm3).toBe(1);
    expect(r.boundingBoxMm).toEqual({ min: [0, 0, 0], max: [10, 10, 10], size: [10, 10, 10] });
  });

  it('cylinder converges to 2πrh + 2πr² and πr²h as segments increase', () => {
    const R = 10, H = 20;
    const area = (2 * Math.PI * R * H + 2 * Math.PI * R * R) / 1e4;
    const volume = (Math.PI * R * R * H) / 1e3;
    let lastAreaErr = Infinity, lastVolErr = Infinity;
    for (const n of [8, 16, 32, 64, 128, 256]) {
      const r = analyzeStl(makeBinaryStl(cylinderMesh(R, H, n)));
      // The mesh is an inscribed n-gon prism: its own area and volume are known exactly.
      const polygon = (n / 2) * R * R * Math.sin((2 * Math.PI) / n);
      const prismArea = (n * 2 * R * Math.sin(Math.PI / n) * H + 2 * polygon) / 1e4;
      expect(rel(r.areaDm2, prismArea)).toBeLessThan(1e-6); // float32 coordinates
      expect(rel(r.signedVolumeCm3, (polygon * H) / 1e3)).toBeLessThan(1e-6);
      const areaErr = rel(r.areaDm2, area), volErr = rel(r.signedVolumeCm3, volume);
      expect(areaErr).toBeLessThan(lastAreaErr);
      expect(volErr).toBeLessThan(lastVolErr);
      [lastAreaErr, lastVolErr] = [areaErr, volErr];
    }
    expect(lastAreaErr).toBeLessThan(2e-4);
    expect(lastVolErr).toBeLessThan(2e-4);
  });

  it('UV sphere converges to 4πr² and 4πr³/3 as segments increase', () => {
    const R = 10;
    const area = (4 * Math.PI * R * R) / 1e4, volume = ((4 / 3) * Math.PI * R ** 3) / 1e3;
    let lastAreaErr = Infinity, lastVolErr = Infinity;
    for (const n of [8, 16, 32, 64, 128, 256]) {
      const r = analyzeStl(makeBinaryStl(uvSphereMesh(R, n)));
      expect(r.triangleCount).toBe(2 * n * (n / 2 - 1));
      const areaErr = rel(r.areaDm2, area), volErr = rel(r.signedVolumeCm3, volume);
      expect(areaErr).toBeLessThan(lastAreaErr);
      expect(volErr).toBeLessThan(lastVolErr);
      [lastAreaErr, lastVolErr] = [areaErr, volErr];
    }
    expect(lastAreaErr).toBeLessThan(3e-4);
    expect(lastVolErr).toBeLessThan(5e-4);
  });

  it('keeps volume exact far from the origin', () => {
    const shifted = [...cubeMesh(10).triangles()].map(
      (t) => t.map(([x, y, z]) => [x + 1e6, y - 2e6, z + 3e6]) as unknown as Triangle,
    );
    const r = analyzeStl(makeBinaryStl(shifted));
    expect(r.signedVolumeCm3).toBeCloseTo(1, 9);
    expect(r.areaDm2).toBeCloseTo(0.06, 9);
  });

  it('reports negative signed volume for inward-facing facets, with a positive volume', () => {
    const flipped = [...cubeMesh(10).triangles()].map(([a, b, c]) => [a, c, b] as Triangle);
    const r = analyzeStl(makeBinaryStl(flipped), { densityGPerCm3: 7.85 });
    expect(r.signedVolumeCm3).toBe(-1);
    expect(r.volumeCm3).toBe(1);
    expect(r.weightG).toBeCloseTo(7.85, 12);
  });
});

describe('formats and units', () => {
  const sphere = float32Mesh(uvSphereMesh(12.5, 24));

  it('binary and ASCII give the same answer', () => {
    const b = analyzeStl(makeBinaryStl(sphere));
    const a = analyzeStl(encode(makeAsciiStl(sphere, 'sphere')));
    expect([b.format, a.format]).toEqual(['binary', 'ascii']);
    expect(a.triangleCount).toBe(b.triangleCount);
    expect(rel(a.areaDm2, b.areaDm2)).toBeLessThan(1e-9);
    expect(rel(a.signedVolumeCm3, b.signedVolumeCm3)).toBeLessThan(1e-9);
    a.boundingBoxMm.min.forEach((v, i) => expect(v).toBeCloseTo(b.boundingBoxMm.min[i]!, 6));
  });

  it('reads a binary file whose header begins with "solid" as binary', () => {
    const bytes = makeBinaryStl(sphere, 'solid sphere exported with facet normals');
    const r = analyzeStl(bytes);
    expect(r.format).toBe('binary');
    expect(r.triangleCount).toBe(sphere.triangleCount);
  });

  it('accepts CRLF, upper-case keywords, a BOM, leading blanks and several solids', () => {
    const one = makeAsciiStl(cubeMesh(10), 'a');
    const text = '\uFEFF  \r\n' + one.toUpperCase().replace(/\n/g, '\r\n') + makeAsciiStl(cubeMesh(10), 'b');
    const r = analyzeStl(encode(text));
    expect(r.format).toBe('ascii');
    expect(r.triangleCount).toBe(24);
    expect(r.areaDm2).toBeCloseTo(0.12, 12);
  });

  it('accepts "solid" alone on its line and a name with keywords in it', () => {
    const body = makeAsciiStl(cubeMesh(10)).split('\n').slice(1, -2).join('\n');
    expect(analyzeStl(encode(`solid\n${body}\nendsolid\n`)).triangleCount).toBe(12);
    expect(analyzeStl(encode(`solid facet endsolid vertex\n${body}\nendsolid facet`)).triangleCount).toBe(12);
  });

  it('inch files scale area by 25.4², volume by 25.4³ and the box by 25.4', () => {
    const bytes = makeBinaryStl(sphere);
    const mm = analyzeStl(bytes, { unit: 'mm' });
    const inch = analyzeStl(bytes, { unit: 'in' });
    expect(rel(inch.areaDm2, mm.areaDm2 * 25.4 ** 2)).toBeLessThan(1e-12);
    expect(rel(inch.signedVolumeCm3, mm.signedVolumeCm3 * 25.4 ** 3)).toBeLessThan(1e-12);
    expect(rel(inch.boundingBoxMm.size[0], mm.boundingBoxMm.size[0] * 25.4)).toBeLessThan(1e-12);
  });

  it('weighs the part when given a density', () => {
    const r = analyzeStl(makeBinaryStl(cubeMesh(20)), { densityGPerCm3: 2.7 });
    expect(r.weightG).toBeCloseTo(8 * 2.7, 12);
    expect(analyzeStl(makeBinaryStl(cubeMesh(20))).weightG).toBeNull();
  });
});

describe('streaming', () => {
  const mesh = float32Mesh(uvSphereMesh(5, 12));
  const binary = makeBinaryStl(mesh, 'solid but binary');
  const ascii = encode(makeAsciiStl(mesh));
  const whole = { b: analyzeStl(binary), a: analyzeStl(ascii) };

  it('gives the same result however the bytes are split into chunks', () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 1, max: 300 }), { minLength: 1, maxLength: 20 }), (sizes) => {
        expect(parseInChunks(binary, sizes)).toEqual(whole.b);
        expect(parseInChunks(ascii, sizes)).toEqual(whole.a);
      }),
      { numRuns: 60 },
    );
  });

  it('copes with one byte at a time', () => {
    expect(parseInChunks(binary, [1])).toEqual(whole.b);
    expect(parseInChunks(ascii, [1])).toEqual(whole.a);
  });

  it('accepts a mesh built from a plain triangle list', () => {
    const list: Triangle[] = [[[0, 0, 0], [1, 0, 0], [0, 1, 0]]];
    expect(analyzeStl(makeBinaryStl(meshOf(list))).areaDm2).toBeCloseTo(0.5e-4, 15);
  });
});
