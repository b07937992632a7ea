// Tells a file's type from its bytes, then checks the name and the browser's declared type agree.
// Pure: no I/O. The name and the declared type alone are never trusted.
// Magic numbers: ISO 32000-1 §7.5.2 (PDF "%PDF-"), PNG spec §5.2 (8-byte signature), JPEG/JFIF
// SOI marker FF D8 FF, GIF89a spec (GIF87a/GIF89a), WebP container spec (RIFF….WEBP), PKWARE
// APPNOTE §4.3.7 (ZIP local header PK\3\4), ECMA-376 Part 2 ([Content_Types].xml in an XLSX).
// Binary STL: 80-byte header, uint32 triangle count, 50 bytes per triangle (so size = 84 + 50·n).

export type FileKind = 'pdf' | 'png' | 'jpeg' | 'gif' | 'webp' | 'zip' | 'xlsx' | 'stl' | 'csv' | 'text';

export const FILE_KIND_LABEL: Record<FileKind, string> = {
  pdf: 'a PDF document',
  png: 'a PNG image',
  jpeg: 'a JPEG image',
  gif: 'a GIF image',
  webp: 'a WebP image',
  zip: 'a ZIP archive',
  xlsx: 'an Excel workbook (XLSX)',
  stl: 'an STL model',
  csv: 'a CSV file',
  text: 'a plain text file',
};

export const CONTENT_TYPE: Record<FileKind, string> = {
  pdf: 'application/pdf',
  png: 'image/png',
  jpeg: 'image/jpeg',
  gif: 'image/gif',
  webp: 'image/webp',
  zip: 'application/zip',
  xlsx: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
  stl: 'model/stl',
  csv: 'text/csv; charset=utf-8',
  text: 'text/plain; charset=utf-8',
};

/** Groups for `allowed`. */
export const FILE_KINDS = {
  drawing: ['pdf', 'png', 'jpeg', 'gif', 'webp'],
  image: ['png', 'jpeg', 'gif', 'webp'],
  stl: ['stl'],
  csv: ['csv', 'text'],
  export: ['csv', 'text', 'xlsx', 'pdf'],
} as const satisfies Record<string, readonly FileKind[]>;

const MIB = 1024 * 1024;
/** Upload limits: 25 MiB for most files, 64 MiB for STL models (also the table's CHECK). */
export const MAX_FILE_BYTES = 25 * MIB;
export const MAX_STL_BYTES = 64 * MIB;

// Extensions each kind may carry. A name with none of the known extensions is judged by content.
const EXTENSIONS: Record<FileKind, readonly string[]> = {
  pdf: ['pdf'],
  png: ['png'],
  jpeg: ['jpg', 'jpeg', 'jpe', 'jfif'],
  gif: ['gif'],
  webp: ['webp'],
  zip: ['zip'],
  xlsx: ['xlsx'],
  stl: ['stl'],
  csv: ['csv', 'txt'],
  text: ['txt', 'csv', 'log', 'tsv'],
};
const KNOWN_EXTENSIONS = new Set(Object.values(EXTENSIONS).flat());

// Browser-declared types that say nothing (or that browsers use loosely for several kinds).
const VAGUE_TYPES = new Set(['', 'application/octet-stream', 'binary/octet-stream', 'application/unknown']);
const DECLARED: Record<FileKind, readonly string[]> = {
  pdf: ['application/pdf', 'application/x-pdf'],
  png: ['image/png'],
  jpeg: ['image/jpeg', 'image/pjpeg', 'image/jpg'],
  gif: ['image/gif'],
  webp: ['image/webp'],
  zip: ['application/zip', 'application/x-zip-compressed'],
  xlsx: ['application/vnd.openxmlformats-officedocument.spreadsheetml.sheet'],
  stl: ['model/stl', 'model/x.stl-binary', 'model/x.stl-ascii', 'application/sla', 'application/vnd.ms-pki.stl', 'application/stl'],
  // Windows browsers often label CSV as an Excel type.
  csv: ['text/csv', 'text/plain', 'application/csv', 'application/vnd.ms-excel', 'text/comma-separated-values'],
  text: ['text/plain', 'text/csv', 'text/tab-separated-values', 'application/vnd.ms-excel'],
};

function startsWith(bytes: Uint8Array, sig: readonly number[], at = 0): boolean {
  return sig.every((b, i) => bytes[at + i] === b);
}

function ascii(bytes: Uint8Array, from: number, to: number): string {
  return new TextDecoder('latin1').decode(bytes.subarray(from, Math.min(to, bytes.length)));
}

function isBinaryStlSize(head: Uint8Array, totalBytes: number): boolean {
  if (head.length < 84 || totalBytes < 84 + 50) return false;
  const count = new DataView(head.buffer, head.byteOffset, head.byteLength).getUint32(80, true);
  return count > 0 && totalBytes === 84 + 50 * count;
}

function isUtf8Text(head: Uint8Array, complete: boolean): boolean {
  // A multi-byte character may be cut at the end of a partial head; drop up to 3 trailing bytes.
  let view = head;
  if (!complete) {
    let cut = view.length;
    for (let i = view.length - 1; i >= Math.max(0, view.length - 3); i--) {
      if ((view[i]! & 0xc0) === 0x80) continue;
      if (view[i]! >= 0xc0) cut = i;
      break;
    }
    view = view.subarray(0, cut);
  }
  try {
    new TextDecoder('utf-8', { fatal: true }).decode(view);
  } catch {
    return false;
  }
  // Text has no NUL and few other control characters (tab, CR, LF, form feed are fine).
  let control = 0;
  for (const b of view) {
    if (b === 0) return false;
    if (b < 32 && b !== 9 && b !== 10 && b !== 13 && b !== 12) control++;
  }
  return control <= view.length / 100;
}

function startsWithSolidWord(head: Uint8Array): boolean {
  return /^(\ufeff)?\s*solid(\s|$)/i.test(new TextDecoder().decode(head.subarray(0, 200)));
}

/**
 * The kind the bytes show. `head` is the start of the file (at least 8 KiB, or all of it);
 * `totalBytes` the full size, needed to recognise a binary STL. Null when the content is none of
 * the kinds we accept.
 */
export function sniffKind(head: Uint8Array, totalBytes: number, name = ''): FileKind | null {
  if (startsWith(head, [0x25, 0x50, 0x44, 0x46, 0x2d])) return 'pdf';
  if (startsWith(head, [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return 'png';
  if (startsWith(head, [0xff, 0xd8, 0xff])) return 'jpeg';
  if (ascii(head, 0, 6) === 'GIF87a' || ascii(head, 0, 6) === 'GIF89a') return 'gif';
  if (ascii(head, 0, 4) === 'RIFF' && ascii(head, 8, 12) === 'WEBP') return 'webp';
  if (startsWith(head, [0x50, 0x4b, 0x03, 0x04]) || startsWith(head, [0x50, 0x4b, 0x05, 0x06])) {
    const names = ascii(head, 0, 64 * 1024);
    return names.includes('[Content_Types].xml') && names.includes('xl/') ? 'xlsx' : 'zip';
  }
  // Before the text test: a binary STL's header may be plain text ("solid …"), its body is not.
  if (isBinaryStlSize(head, totalBytes)) return 'stl';
  const complete = head.length >= totalBytes;
  if (isUtf8Text(head, complete)) {
    if (startsWithSolidWord(head) && /\bfacet\b/i.test(new TextDecoder().decode(head.subarray(0, 4096)))) return 'stl';
    return extensionOf(name) === 'csv' ? 'csv' : 'text';
  }
  return null;
}

export function extensionOf(name: string): string {
  const m = /\.([A-Za-z0-9]{1,8})$/.exec(name.trim());
  return m ? m[1]!.toLowerCase() : '';
}

export type SniffCheck = { ok: true; kind: FileKind; contentType: string } | { ok: false; message: string };

const list = (kinds: readonly FileKind[]) => [...new Set(kinds.map((k) => FILE_KIND_LABEL[k]))].join(', ');

/** Sniffs, then refuses content that is not allowed or that the name or declared type contradict. */
export function checkFileType(input: {
  head: Uint8Array;
  totalBytes: number;
  name: string;
  declaredType?: string | null;
  allowed: readonly FileKind[];
}): SniffCheck {
  const { name, allowed } = input;
  const kind = sniffKind(input.head, input.totalBytes, name);
  if (!kind) return { ok: false, message: `"${name}" is not a type we accept here. Accepted: ${list(allowed)}.` };
  // CSV and plain text are the same bytes; a .csv name makes it CSV.
  const effective: FileKind = kind === 'text' && allowed.includes('csv') && !allowed.includes('text') ? 'csv' : kind;
  if (!allowed.includes(effective)) {
    return { ok: false, message: `"${name}" is ${FILE_KIND_LABEL[effective]}; accepted here: ${list(allowed)}.` };
  }
  const ext = extensionOf(name);
  if (ext && KNOWN_EXTENSIONS.has(ext) && !EXTENSIONS[effective].includes(ext)) {
    return { ok: false, message: `"${name}" is named .${ext} but its content is ${FILE_KIND_LABEL[effective]}. Rename it or upload the right file.` };
  }
  const declared = (input.declaredType ?? '').split(';')[0]!.trim().toLowerCase();
  if (!VAGUE_TYPES.has(declared) && !DECLARED[effective].includes(declared)) {
    return { ok: false, message: `"${name}" was sent as ${declared} but its content is ${FILE_KIND_LABEL[effective]}.` };
  }
  return { ok: true, kind: effective, contentType: CONTENT_TYPE[effective] };
}

/** The size limit for a set of allowed kinds, never above the caller's own limit. */
export function sizeLimit(allowed: readonly FileKind[], maxBytes?: number): number {
  const cap = allowed.includes('stl') ? MAX_STL_BYTES : MAX_FILE_BYTES;
  return Math.min(cap, maxBytes ?? cap);
}

/** "25 MB", "9.8 KB": sizes in binary units as people read them on upload screens. */
export function formatBytes(bytes: number): string {
  if (bytes < 1024 * 1024) return `${Math.round((bytes / 1024) * 10) / 10} KB`;
  return `${Math.round((bytes / MIB) * 10) / 10} MB`;
}
