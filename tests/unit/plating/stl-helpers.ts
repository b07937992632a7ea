import { StlParser, type Mesh, type StlAnalysis, type StlOptions, type Triangle } from '@/lib/plating';

// Helpers shared by the STL tests.

export const encode = (text: string) => new TextEncoder().encode(text);

// The same mesh with every coordinate rounded to float32, so a binary file (float32) and an ASCII
// file (printed with 9 decimals) describe the same triangles.
export function float32Mesh(mesh: Mesh): Mesh {
  const list = [...mesh.triangles()].map(
    (t) => t.map((v) => v.map(Math.fround)) as unknown as Triangle,
  );
  return { triangleCount: list.length, triangles: () => list };
}

// Parses `bytes` pushed in the given chunk sizes (cycled).
export function parseInChunks(bytes: Uint8Array, sizes: number[], options?: StlOptions): StlAnalysis {
  const parser = new StlParser(options);
  let at = 0;
  for (let k = 0; at < bytes.length; k++) {
    const size = Math.max(1, sizes[k % sizes.length]!);
    parser.push(bytes.subarray(at, at + size));
    at += size;
  }
  return parser.finish();
}

export const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
