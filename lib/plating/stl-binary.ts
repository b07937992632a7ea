import { StlError } from './errors';
import { MeshAccumulator, RECORD_BYTES, type MeshTotals } from './stl-geometry';

// Streaming reader for binary STL: an 80-byte header, a little-endian uint32 triangle count, then
// one 50-byte record per triangle (normal, three vertices as float32, a 2-byte attribute).
// A record split across chunks is carried in a fixed 50-byte buffer, so memory stays O(1).

export const BINARY_HEADER_BYTES = 84;
export const BINARY_RECORD_BYTES = RECORD_BYTES;

export class BinaryStlReader {
  private readonly header = new Uint8Array(BINARY_HEADER_BYTES);
  private headerBytes = 0;
  private declared = -1;
  private readonly carry = new Uint8Array(BINARY_RECORD_BYTES);
  private readonly carryView = new DataView(this.carry.buffer);
  private carryBytes = 0;
  private records = 0;
  private readonly mesh = new MeshAccumulator();
  byteLength = 0;

  push(chunk: Uint8Array): void {
    this.byteLength += chunk.length;
    let pos = 0;
    if (this.headerBytes < BINARY_HEADER_BYTES) {
      pos = Math.min(BINARY_HEADER_BYTES - this.headerBytes, chunk.length);
      this.header.set(chunk.subarray(0, pos), this.headerBytes);
      this.headerBytes += pos;
      if (this.headerBytes < BINARY_HEADER_BYTES) return;
      this.declared = new DataView(this.header.buffer).getUint32(80, true);
    }
    if (pos === chunk.length) return;

    if (this.carryBytes > 0) {
      const take = Math.min(BINARY_RECORD_BYTES - this.carryBytes, chunk.length - pos);
      this.carry.set(chunk.subarray(pos, pos + take), this.carryBytes);
      this.carryBytes += take;
      pos += take;
      if (this.carryBytes < BINARY_RECORD_BYTES) return;
      this.readRecords(this.carryView, 0, 1);
      this.carryBytes = 0;
    }

    const whole = Math.floor((chunk.length - pos) / BINARY_RECORD_BYTES);
    if (whole > 0) {
      this.readRecords(new DataView(chunk.buffer, chunk.byteOffset, chunk.byteLength), pos, whole);
      pos += whole * BINARY_RECORD_BYTES;
    }

    if (pos < chunk.length) {
      this.carry.set(chunk.subarray(pos), 0);
      this.carryBytes = chunk.length - pos;
      this.checkRoomFor(this.records + 1);
    }
  }

  private checkRoomFor(records: number): void {
    if (records > this.declared) {
      throw new StlError(
        'count-mismatch',
        `The binary STL header declares ${this.declared} triangles ` +
          `(${BINARY_HEADER_BYTES + BINARY_RECORD_BYTES * this.declared} bytes), but the file is longer.`,
      );
    }
  }

  private readRecords(view: DataView, at: number, count: number): void {
    this.checkRoomFor(this.records + count);
    this.mesh.addRecords(view, at, count);
    this.records += count;
  }

  finish(): MeshTotals {
    if (this.headerBytes < BINARY_HEADER_BYTES) {
      throw new StlError(
        'truncated',
        `The file is ${this.byteLength} bytes, shorter than the 84-byte header of a binary STL.`,
      );
    }
    const expected = BINARY_HEADER_BYTES + BINARY_RECORD_BYTES * this.declared;
    if (this.records < this.declared) {
      throw new StlError(
        'truncated',
        `The binary STL header declares ${this.declared} triangles (${expected} bytes), but the file ` +
          `has ${this.byteLength} bytes: it stops after ${this.records} whole triangles.`,
      );
    }
    if (this.carryBytes > 0) this.checkRoomFor(this.records + 1);
    if (this.declared === 0) {
      throw new StlError('empty', 'The binary STL contains no triangles.');
    }
    return this.mesh.totals();
  }
}
