import { StlError } from './errors';

// Running totals over a triangle stream: area, signed volume, bounding box. O(1) memory.
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

  add(
    ax: number, ay: number, az: number,
    bx: number, by: number, bz: number,
    cx: number, cy: number, cz: number,
  ): void {
    // x − x is 0 for every finite x and NaN for NaN or ±Infinity: one test for all nine.
    if (ax - ax + (ay - ay) + (az - az) + (bx - bx) + (by - by) + (bz - bz) + (cx - cx) + (cy - cy) + (cz - cz) !== 0) {
      throw new StlError(
        'non-finite',
        `Triangle ${this.triangleCount + 1} has a coordinate that is not a finite number (NaN or Infinity).`,
      );
    }
    if (this.triangleCount === 0) {
      this.ox = ax;
      this.oy = ay;
      this.oz = az;
    }
    this.triangleCount++;

    if (ax < this.minX) this.minX = ax; if (ax > this.maxX) this.maxX = ax;
    if (bx < this.minX) this.minX = bx; if (bx > this.maxX) this.maxX = bx;
    if (cx < this.minX) this.minX = cx; if (cx > this.maxX) this.maxX = cx;
    if (ay < this.minY) this.minY = ay; if (ay > this.maxY) this.maxY = ay;
    if (by < this.minY) this.minY = by; if (by > this.maxY) this.maxY = by;
    if (cy < this.minY) this.minY = cy; if (cy > this.maxY) this.maxY = cy;
    if (az < this.minZ) this.minZ = az; if (az > this.maxZ) this.maxZ = az;
    if (bz < this.minZ) this.minZ = bz; if (bz > this.maxZ) this.maxZ = bz;
    if (cz < this.minZ) this.minZ = cz; if (cz > this.maxZ) this.maxZ = cz;

    const ux = bx - ax, uy = by - ay, uz = bz - az;
    const vx = cx - ax, vy = cy - ay, vz = cz - az;
    const nx = uy * vz - uz * vy;
    const ny = uz * vx - ux * vz;
    const nz = ux * vy - uy * vx;
    this.doubleArea += Math.sqrt(nx * nx + ny * ny + nz * nz);
    // a'·(b'×c') equals a'·((b'−a')×(c'−a')), so the cross product above serves both sums.
    this.sixVolume += (ax - this.ox) * nx + (ay - this.oy) * ny + (az - this.oz) * nz;
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
