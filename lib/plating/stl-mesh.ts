import { PlatingInputError } from './errors';
import { BINARY_HEADER_BYTES, BINARY_RECORD_BYTES } from './stl-binary';
import type { Vec3 } from './stl-geometry';
import { requirePositive } from './validate';

// Test meshes and STL writers: the unit tests and the benchmark build their files here. Meshes are
// generated lazily so a million-triangle file never sits in memory as triangles. Facets are wound
// counter-clockwise seen from outside, so closed meshes have positive signed volume.

export type Triangle = readonly [Vec3, Vec3, Vec3];
export type Mesh = { readonly triangleCount: number; triangles(): Iterable<Triangle> };

export function meshOf(list: readonly Triangle[]): Mesh {
  return { triangleCount: list.length, triangles: () => list };
}

function asMesh(input: Mesh | readonly Triangle[]): Mesh {
  return Array.isArray(input) ? meshOf(input as readonly Triangle[]) : (input as Mesh);
}

function normalOf([a, b, c]: Triangle): Vec3 {
  const u = [b[0] - a[0], b[1] - a[1], b[2] - a[2]];
  const v = [c[0] - a[0], c[1] - a[1], c[2] - a[2]];
  const n: Vec3 = [u[1]! * v[2]! - u[2]! * v[1]!, u[2]! * v[0]! - u[0]! * v[2]!, u[0]! * v[1]! - u[1]! * v[0]!];
  const len = Math.hypot(...n) || 1;
  return [n[0] / len, n[1] / len, n[2] / len];
}

function writeHeader(target: Uint8Array, count: number, header: string): void {
  for (let i = 0; i < Math.min(header.length, 80); i++) target[i] = header.charCodeAt(i) & 0x7f;
  new DataView(target.buffer, target.byteOffset).setUint32(80, count, true);
}

function writeRecord(view: DataView, at: number, t: Triangle): void {
  const floats = [...normalOf(t), ...t[0], ...t[1], ...t[2]];
  floats.forEach((f, k) => view.setFloat32(at + 4 * k, f, true));
  view.setUint16(at + 48, 0, true);
}

// Yields the header, then records in chunks: for writing large files to a stream.
export function* binaryStlChunks(
  input: Mesh | readonly Triangle[],
  { header = 'binary STL', trianglesPerChunk = 20_000 }: { header?: string; trianglesPerChunk?: number } = {},
): Generator<Uint8Array> {
  const mesh = asMesh(input);
  const head = new Uint8Array(BINARY_HEADER_BYTES);
  writeHeader(head, mesh.triangleCount, header);
  yield head;
  let chunk = new Uint8Array(trianglesPerChunk * BINARY_RECORD_BYTES);
  let view = new DataView(chunk.buffer);
  let filled = 0;
  for (const t of mesh.triangles()) {
    writeRecord(view, filled * BINARY_RECORD_BYTES, t);
    if (++filled === trianglesPerChunk) {
      yield chunk;
      chunk = new Uint8Array(trianglesPerChunk * BINARY_RECORD_BYTES);
      view = new DataView(chunk.buffer);
      filled = 0;
    }
  }
  if (filled > 0) yield chunk.subarray(0, filled * BINARY_RECORD_BYTES);
}

export function makeBinaryStl(input: Mesh | readonly Triangle[], header = 'binary STL'): Uint8Array {
  const mesh = asMesh(input);
  const out = new Uint8Array(BINARY_HEADER_BYTES + BINARY_RECORD_BYTES * mesh.triangleCount);
  let at = 0;
  for (const chunk of binaryStlChunks(mesh, { header })) {
    out.set(chunk, at);
    at += chunk.length;
  }
  return out;
}

export function makeAsciiStl(input: Mesh | readonly Triangle[], name = 'part'): string {
  const lines = [`solid ${name}`];
  for (const t of asMesh(input).triangles()) {
    lines.push(`  facet normal ${normalOf(t).join(' ')}`, '    outer loop');
    for (const v of t) lines.push(`      vertex ${v.map((x) => x.toExponential(9)).join(' ')}`);
    lines.push('    endloop', '  endfacet');
  }
  lines.push(`endsolid ${name}`, '');
  return lines.join('\n');
}

// Axis-aligned cube from the origin: 12 triangles.
export function cubeMesh(edgeMm: number): Mesh {
  const e = requirePositive('edgeMm', 'Cube edge (mm)', edgeMm);
  const p = (x: number, y: number, z: number): Vec3 => [x * e, y * e, z * e];
  const quad = (a: Vec3, b: Vec3, c: Vec3, d: Vec3): Triangle[] => [[a, b, c], [a, c, d]];
  const list = [
    ...quad(p(0, 0, 0), p(0, 1, 0), p(1, 1, 0), p(1, 0, 0)), // bottom, facing −z
    ...quad(p(0, 0, 1), p(1, 0, 1), p(1, 1, 1), p(0, 1, 1)), // top
    ...quad(p(0, 0, 0), p(1, 0, 0), p(1, 0, 1), p(0, 0, 1)), // front, facing −y
    ...quad(p(0, 1, 0), p(0, 1, 1), p(1, 1, 1), p(1, 1, 0)), // back
    ...quad(p(0, 0, 0), p(0, 0, 1), p(0, 1, 1), p(0, 1, 0)), // left, facing −x
    ...quad(p(1, 0, 0), p(1, 1, 0), p(1, 1, 1), p(1, 0, 1)), // right
  ];
  return meshOf(list);
}

function requireSegments(segments: number, minimum: number): number {
  if (!Number.isSafeInteger(segments) || segments < minimum) {
    throw new PlatingInputError('segments', `Segments must be a whole number of at least ${minimum}.`);
  }
  return segments;
}

// Closed cylinder about the z axis, base at z = 0, as an inscribed N-sided prism: 4N triangles.
export function cylinderMesh(radiusMm: number, heightMm: number, segments: number): Mesh {
  const r = requirePositive('radiusMm', 'Radius (mm)', radiusMm);
  const h = requirePositive('heightMm', 'Height (mm)', heightMm);
  const n = requireSegments(segments, 3);
  const rim = (i: number, z: number): Vec3 => {
    const a = (2 * Math.PI * (i % n)) / n;
    return [r * Math.cos(a), r * Math.sin(a), z];
  };
  return {
    triangleCount: 4 * n,
    *triangles() {
      for (let i = 0; i < n; i++) {
        const [b0, b1, t0, t1] = [rim(i, 0), rim(i + 1, 0), rim(i, h), rim(i + 1, h)];
        yield [b0, b1, t1];
        yield [b0, t1, t0];
        yield [[0, 0, 0], b1, b0];
        yield [[0, 0, h], t0, t1];
      }
    },
  };
}

// UV sphere about the origin: N segments of longitude, N/2 bands of latitude (at least 2).
// Triangle count is 2·N·(bands − 1).
export function uvSphereMesh(radiusMm: number, segments: number, bands = Math.max(2, Math.round(segments / 2))): Mesh {
  const r = requirePositive('radiusMm', 'Radius (mm)', radiusMm);
  const n = requireSegments(segments, 3);
  const m = requireSegments(bands, 2);
  const point = (i: number, j: number): Vec3 => {
    const theta = (Math.PI * j) / m; // from the north pole
    const phi = (2 * Math.PI * (i % n)) / n;
    return [r * Math.sin(theta) * Math.cos(phi), r * Math.sin(theta) * Math.sin(phi), r * Math.cos(theta)];
  };
  return {
    triangleCount: 2 * n * (m - 1),
    *triangles() {
      for (let j = 0; j < m; j++) {
        for (let i = 0; i < n; i++) {
          const [a, b, c, d] = [point(i, j), point(i, j + 1), point(i + 1, j + 1), point(i + 1, j)];
          if (j > 0) yield [a, b, d];
          if (j < m - 1) yield [b, c, d];
        }
      }
    },
  };
}
