import { describe, expect, it } from 'vitest';
import { checkFileType, FILE_KINDS, MAX_FILE_BYTES, MAX_STL_BYTES, sizeLimit, sniffKind } from '@/lib/files/sniff';
import { cubeMesh, makeAsciiStl, makeBinaryStl } from '@/lib/plating';

const bytes = (...parts: (string | number[])[]) =>
  Uint8Array.from(parts.flatMap((p) => (typeof p === 'string' ? [...Buffer.from(p, 'latin1')] : p)));

// Signatures: ISO 32000-1 §7.5.2; PNG spec §5.2; JFIF SOI; GIF89a spec; WebP container; PKWARE APPNOTE §4.3.7.
const PDF = bytes('%PDF-1.7\n%\xe2\xe3\xcf\xd3\n1 0 obj');
const PNG = bytes([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a], [0, 0, 0, 13], 'IHDR');
const JPEG = bytes([0xff, 0xd8, 0xff, 0xe0, 0, 16], 'JFIF');
const GIF = bytes('GIF89a', [1, 0, 1, 0]);
const WEBP = bytes('RIFF', [36, 0, 0, 0], 'WEBPVP8 ');
const ZIP = bytes([0x50, 0x4b, 0x03, 0x04], 'xxxxxxxxxxxxxxxxxxxxxxxxxx', 'notes.txt');
const XLSX = bytes([0x50, 0x4b, 0x03, 0x04], 'xxxxxxxxxxxxxxxxxxxxxxxxxx', '[Content_Types].xml', 'zzzz', 'xl/workbook.xml');
const CSV = bytes('code,name\r\nNGF,Northgate Fastener\r\n');

function sniff(b: Uint8Array, name = '') {
  return sniffKind(b, b.length, name);
}

describe('sniffKind', () => {
  it('recognises the signatures', () => {
    expect(sniff(PDF)).toBe('pdf');
    expect(sniff(PNG)).toBe('png');
    expect(sniff(JPEG)).toBe('jpeg');
    expect(sniff(GIF)).toBe('gif');
    expect(sniff(WEBP)).toBe('webp');
    expect(sniff(ZIP)).toBe('zip');
    expect(sniff(XLSX)).toBe('xlsx');
  });

  it('tells binary from ASCII STL, including a binary whose header says "solid"', () => {
    const cube = cubeMesh(10);
    expect(sniff(makeBinaryStl(cube))).toBe('stl');
    expect(sniff(makeBinaryStl(cube, 'solid exported by a CAD program'))).toBe('stl');
    expect(sniff(new TextEncoder().encode(makeAsciiStl(cube)))).toBe('stl');
  });

  it('does not call a truncated binary STL an STL', () => {
    const stl = makeBinaryStl(cubeMesh(10));
    expect(sniffKind(stl.subarray(0, stl.length - 7), stl.length - 7)).toBeNull();
  });

  it('reads UTF-8 text as CSV when named .csv, else as plain text', () => {
    expect(sniff(CSV, 'customers.csv')).toBe('csv');
    expect(sniff(CSV, 'customers')).toBe('text');
    expect(sniff(new TextEncoder().encode('Größe;Maß\n'), 'a.csv')).toBe('csv');
  });

  it('refuses bytes that are no known kind', () => {
    expect(sniff(bytes([0x00, 0x01, 0x02, 0xfe, 0xff, 0x10]))).toBeNull();
    expect(sniff(bytes('MZ', [0x90, 0, 3, 0, 0, 0]))).toBeNull(); // a Windows executable
    expect(sniff(bytes([0xc3, 0x28, 0x41]))).toBeNull(); // invalid UTF-8
  });

  it('does not reject text whose head was cut inside a multi-byte character', () => {
    const text = new TextEncoder().encode('ü'.repeat(10));
    expect(sniffKind(text.subarray(0, 5), text.length, 'a.txt')).toBe('text');
  });
});

describe('checkFileType', () => {
  const check = (b: Uint8Array, name: string, allowed: readonly string[], declaredType?: string) =>
    checkFileType({ head: b, totalBytes: b.length, name, declaredType, allowed: allowed as never });

  it('accepts matching content, name and declared type', () => {
    expect(check(PDF, 'drawing.pdf', FILE_KINDS.drawing, 'application/pdf')).toEqual({ ok: true, kind: 'pdf', contentType: 'application/pdf' });
    expect(check(PNG, 'photo', FILE_KINDS.drawing, '')).toMatchObject({ ok: true, kind: 'png' });
    expect(check(CSV, 'c.csv', FILE_KINDS.csv, 'application/vnd.ms-excel')).toMatchObject({ ok: true, kind: 'csv', contentType: 'text/csv; charset=utf-8' });
  });

  it('refuses content the name contradicts', () => {
    expect(check(PNG, 'drawing.pdf', FILE_KINDS.drawing)).toEqual({
      ok: false,
      message: '"drawing.pdf" is named .pdf but its content is a PNG image. Rename it or upload the right file.',
    });
  });

  it('refuses content the browser type contradicts', () => {
    expect(check(PDF, 'drawing', FILE_KINDS.drawing, 'image/png')).toEqual({
      ok: false,
      message: '"drawing" was sent as image/png but its content is a PDF document.',
    });
  });

  it('refuses a kind not allowed for the upload, naming what is', () => {
    const r = check(ZIP, 'bundle.zip', FILE_KINDS.drawing);
    expect(r).toEqual({ ok: false, message: '"bundle.zip" is a ZIP archive; accepted here: a PDF document, a PNG image, a JPEG image, a GIF image, a WebP image.' });
    expect(check(CSV, 'model.stl', FILE_KINDS.stl)).toMatchObject({ ok: false });
  });
});

describe('size limits', () => {
  it('allows 25 MiB generally and 64 MiB for STL, never above the caller’s own limit', () => {
    expect(MAX_FILE_BYTES).toBe(25 * 1024 * 1024);
    expect(MAX_STL_BYTES).toBe(64 * 1024 * 1024); // also the files table's CHECK (67108864)
    expect(sizeLimit(FILE_KINDS.drawing)).toBe(MAX_FILE_BYTES);
    expect(sizeLimit(FILE_KINDS.stl)).toBe(MAX_STL_BYTES);
    expect(sizeLimit(FILE_KINDS.stl, 1000)).toBe(1000);
    expect(sizeLimit(FILE_KINDS.csv, 10 ** 9)).toBe(MAX_FILE_BYTES);
  });
});
