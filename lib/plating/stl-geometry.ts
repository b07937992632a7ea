import { StlError } from './errors';

// Running totals over a stream of STL triangle records: area, signed volume, bounding box, in
// O(1) memory. Records use the binary STL layout (50 bytes: normal, three vertices as
// little-endian float32, attribute); the ASCII reader packs its facets the same way, so both
// forms of a file give identical answers at the precision the format defines.
//
// Vertices are taken relative to the first vertex seen, which keeps the signed-volume sum from
// cancelling catastrophically for meshes far from the origin (the volume of a closed mesh does
// not depend on the reference point).

export type Vec3 = readonly [number, number, number];

export type MeshTotals = {
  triangleCount: number;
  areaMm2: number; // in file units², scaled by the caller
  signedVolumeMm3: number;
  min: Vec3;
  max: Vec3;
};

export const RECORD_BYTES = 50;
export const VERTEX_OFFSET = 12; // the stored normal is ignored: it is recomputed from vertex order

export class MeshAccumulator {
  triangleCount = 0;
  private doubleArea = 0;
  private sixVolume = 0;
  private ox = 0;
  private oy = 0;
  private oz = 0;
  private minX = Infinity;
  private minY = Infinity;
  private minZ = Infinity;
  private maxX = -Infinity;
  private maxY = -Infinity;
  private maxZ = -Infinity;

  // The hot loop: `count` records starting at byte `at` of `view`. Totals live in locals and are
  // written back once per call, and NaN/Infinity is detected from the sums afterwards rather than
  // per coordinate; together that is about twice as fast as the straightforward loop.
  addRecords(view: DataView, at: number, count: number): void {
    if (count <= 0) return;
    let { doubleArea, sixVolume, minX, minY, minZ, maxX, maxY, maxZ, ox, oy, oz } = this;
    if (this.triangleCount === 0) {
      ox = view.getFloat32(at + VERTEX_OFFSET, true);
      oy = view.getFloat32(at + VERTEX_OFFSET + 4, true);
      oz = view.getFloat32(at + VERTEX_OFFSET + 8, true);
    }
    for (let k = 0, o = at + VERTEX_OFFSET; k < count; k++, o += RECORD_BYTES) {
      const ax = view.getFloat32(o, true), ay = view.getFloat32(o + 4, true), az = view.getFloat32(o + 8, true);
      const bx = view.getFloat32(o + 12, true), by = view.getFloat32(o + 16, true), bz = view.getFloat32(o + 20, true);
      const cx = view.getFloat32(o + 24, true), cy = view.getFloat32(o + 28, true), cz = view.getFloat32(o + 32, true);

      if (ax < minX) minX = ax; if (ax > maxX) maxX = ax;
      if (bx < minX) minX = bx; if (bx > maxX) maxX = bx;
      if (cx < minX) minX = cx; if (cx > maxX) maxX = cx;
      if (ay < minY) minY = ay; if (ay > maxY) maxY = ay;
      if (by < minY) minY = by; if (by > maxY) maxY = by;
      if (cy < minY) minY = cy; if (cy > maxY) maxY = cy;
      if (az < minZ) minZ = az; if (az > maxZ) maxZ = az;
      if (bz < minZ) minZ = bz; if (bz > maxZ) maxZ = bz;
      if (cz < minZ) minZ = cz; if (cz > maxZ) maxZ = cz;

      const ux = bx - ax, uy = by - ay, uz = bz - az;
      const vx = cx - ax, vy = cy - ay, vz = cz - az;
      const nx = uy * vz - uz * vy;
      const ny = uz * vx - ux * vz;
      const nz = ux * vy - uy * vx;
      doubleArea += Math.sqrt(nx * nx + ny * ny + nz * nz);
      // a'·(b'×c') equals a'·((b'−a')×(c'−a')), so the cross product above serves both sums.
      sixVolume += (ax - ox) * nx + (ay - oy) * ny + (az - oz) * nz;
    }
    // A NaN or ±Infinity coordinate always makes the cross product, hence the area sum,
    // non-finite; finite float32 values cannot overflow these double-precision sums.
    if (!Number.isFinite(doubleArea + sixVolume)) this.failNonFinite(view, at, count);
    this.triangleCount += count;
    this.doubleArea = doubleArea;
    this.sixVolume = sixVolume;
    this.minX = minX; this.minY = minY; this.minZ = minZ;
    this.maxX = maxX; this.maxY = maxY; this.maxZ = maxZ;
    this.ox = ox; this.oy = oy; this.oz = oz;
  }

  private failNonFinite(view: DataView, at: number, count: number): never {
    for (let k = 0; k < count; k++) {
      for (let f = 0; f < 9; f++) {
        if (!Number.isFinite(view.getFloat32(at + k * RECORD_BYTES + VERTEX_OFFSET + 4 * f, true))) {
          throw new StlError(
            'non-finite',
            `Triangle ${this.triangleCount + k + 1} has a coordinate that is not a finite number (NaN or Infinity).`,
          );
        }
      }
    }
    throw new StlError('non-finite', 'The coordinates are too large to compute an area or volume.');
  }

  totals(): MeshTotals {
    return {
      triangleCount: this.triangleCount,
      areaMm2: this.doubleArea / 2,
      signedVolumeMm3: this.sixVolume / 6,
      min: [this.minX, this.minY, this.minZ],
      max: [this.maxX, this.maxY, this.maxZ],
    };
  }
}
