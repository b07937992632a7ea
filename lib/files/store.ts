import 'server-only';
// Uploaded files live in PostgreSQL (table `files`) so one backup holds everything. Bytes are
// read chunk by chunk with the size limit enforced as they arrive, hashed (SHA-256) on the way,
// and an STL is analysed by the engine's streaming parser during the same pass.
import { createHash } from 'node:crypto';
import { type Kysely, sql } from 'kysely';
import { db, type Database } from '@/db';
import { AppError } from '@/lib/errors';
import { StlError, StlParser, type StlAnalysis, type StlOptions } from '@/lib/plating';
import { checkFileType, type FileKind, formatBytes, sizeLimit } from './sniff';

export type FileSource = Uint8Array | ReadableStream<Uint8Array>;

export type StoreFileInput = {
  name: string;
  /** Give `bytes` or `stream`. */
  bytes?: Uint8Array;
  stream?: ReadableStream<Uint8Array> | null;
  /** The browser's type: checked against the content, never trusted alone. */
  declaredType?: string | null;
  /** Lower than the standard limit (25 MiB; STL 64 MiB) if the caller wants. */
  maxBytes?: number;
  allowed: readonly FileKind[];
  uploadedBy: string | null;
  /** Unit and density for the STL analysis. */
  stl?: StlOptions;
};

export type StoredFile = {
  id: string;
  name: string;
  kind: FileKind;
  contentType: string;
  sizeBytes: number;
  sha256: string;
  createdAt: Date;
  /** Present when the file is an STL model. */
  stl: StlAnalysis | null;
};

const HEAD_BYTES = 64 * 1024;
// `Generated<Timestamp>` in db/types selects as the column-type wrapper; name the real type here.
const CREATED_AT = sql<Date>`files.created_at`.as('created_at');
const FILE_COLUMNS = ['files.id', 'files.name', 'files.content_type', 'files.size_bytes', 'files.sha256', 'files.uploaded_by', CREATED_AT] as const;
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export function isUuid(id: string): boolean {
  return UUID.test(id);
}

/** A display name without folders or control characters ("C:\fakepath\a.pdf" → "a.pdf"). */
export function safeFileName(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? '';
  // eslint-disable-next-line no-control-regex
  const clean = base.replace(/[\u0000-\u001f\u007f]/g, '').trim();
  return (clean || 'upload').slice(-255);
}

type Collected = { chunks: Uint8Array[]; size: number; sha256: string; head: Uint8Array; stl: StlParser | null; stlError: StlError | null };

async function collect(source: FileSource, name: string, limit: number, stlOptions: StlOptions | null): Promise<Collected> {
  const hash = createHash('sha256');
  const chunks: Uint8Array[] = [];
  let size = 0;
  let stl = stlOptions ? new StlParser(stlOptions) : null;
  let stlError: StlError | null = null;
  const take = (chunk: Uint8Array) => {
    size += chunk.length;
    if (size > limit) throw new AppError('TOO_LARGE', `"${name}" is larger than the ${formatBytes(limit)} limit for this upload.`);
    hash.update(chunk);
    chunks.push(chunk);
    if (stl) {
      try {
        stl.push(chunk);
      } catch (e) {
        if (!(e instanceof StlError)) throw e;
        stlError = e;
        stl = null;
      }
    }
  };
  if (source instanceof Uint8Array) {
    take(source);
  } else {
    const reader = source.getReader();
    try {
      for (;;) {
        const { done, value } = await reader.read();
        if (done) break;
        take(value);
      }
    } catch (e) {
      await reader.cancel().catch(() => undefined);
      throw e;
    } finally {
      reader.releaseLock();
    }
  }
  const headParts: Uint8Array[] = [];
  let headSize = 0;
  for (const c of chunks) {
    if (headSize >= HEAD_BYTES) break;
    headParts.push(c);
    headSize += c.length;
  }
  const head = Buffer.concat(headParts).subarray(0, HEAD_BYTES);
  return { chunks, size, sha256: hash.digest('hex'), head, stl, stlError };
}

function stlResult(c: Collected, name: string): StlAnalysis {
  try {
    if (c.stlError || !c.stl) throw c.stlError ?? new StlError('not-stl', 'The file is not a readable STL.');
    return c.stl.finish();
  } catch (e) {
    if (e instanceof StlError) throw new AppError('BAD_INPUT', `"${name}" is not a readable STL model: ${e.message}`);
    throw e;
  }
}

/** Reads and checks an upload without keeping it (e.g. a CSV to import): its text, decoded as UTF-8. */
export async function readUploadText(input: Omit<StoreFileInput, 'uploadedBy' | 'stl'>): Promise<{ name: string; text: string }> {
  const name = safeFileName(input.name);
  const source = input.bytes ?? input.stream;
  if (!source) throw new AppError('BAD_INPUT', 'No file was sent.');
  const collected = await collect(source, name, sizeLimit(input.allowed, input.maxBytes), null);
  if (collected.size === 0) throw new AppError('BAD_INPUT', `"${name}" is empty.`);
  const check = checkFileType({ head: collected.head, totalBytes: collected.size, name, declaredType: input.declaredType, allowed: input.allowed });
  if (!check.ok) throw new AppError('BAD_INPUT', check.message);
  try {
    // `ignoreBOM: false` drops a leading byte-order mark, which spreadsheet programs often write.
    return { name, text: new TextDecoder('utf-8', { fatal: true }).decode(Buffer.concat(collected.chunks, collected.size)) };
  } catch {
    throw new AppError('BAD_INPUT', `"${name}" is not UTF-8 text. Save it from the spreadsheet as "CSV UTF-8".`);
  }
}

/** Checks, hashes and keeps one uploaded file. Refuses (AppError) a wrong type, a mismatch, an empty or oversized file. */
export async function storeFile(input: StoreFileInput, trx: Kysely<Database> = db): Promise<StoredFile> {
  const name = safeFileName(input.name);
  const source = input.bytes ?? input.stream;
  if (!source) throw new AppError('BAD_INPUT', 'No file was sent.');
  const limit = sizeLimit(input.allowed, input.maxBytes);
  const collected = await collect(source, name, limit, input.allowed.includes('stl') ? (input.stl ?? {}) : null);
  if (collected.size === 0) throw new AppError('BAD_INPUT', `"${name}" is empty.`);

  const check = checkFileType({ head: collected.head, totalBytes: collected.size, name, declaredType: input.declaredType, allowed: input.allowed });
  if (!check.ok) throw new AppError('BAD_INPUT', check.message);
  const stl = check.kind === 'stl' ? stlResult(collected, name) : null;

  const row = await trx
    .insertInto('files')
    .values({
      name,
      content_type: check.contentType,
      size_bytes: collected.size,
      sha256: collected.sha256,
      bytes: Buffer.concat(collected.chunks, collected.size),
      uploaded_by: input.uploadedBy,
    })
    .returning(['id', CREATED_AT])
    .executeTakeFirstOrThrow();
  return {
    id: row.id,
    name,
    kind: check.kind,
    contentType: check.contentType,
    sizeBytes: collected.size,
    sha256: collected.sha256,
    createdAt: row.created_at,
    stl,
  };
}

export type FileRecord = {
  id: string;
  name: string;
  content_type: string;
  size_bytes: number;
  sha256: string;
  uploaded_by: string | null;
  created_at: Date;
};

/** A stored file with its bytes, or null. No permission check: callers use `readFileFor` in access.ts for users. */
export { FILE_COLUMNS };

export async function readFile(id: string, trx: Kysely<Database> = db): Promise<(FileRecord & { bytes: Buffer }) | null> {
  if (!isUuid(id)) return null;
  const row = await trx.selectFrom('files').select([...FILE_COLUMNS, 'files.bytes']).where('id', '=', id).executeTakeFirst();
  return row ?? null;
}

/** The stored file's details without its bytes. */
export async function getFileInfo(id: string, trx: Kysely<Database> = db): Promise<FileRecord | null> {
  if (!isUuid(id)) return null;
  const row = await trx
    .selectFrom('files')
    .select(FILE_COLUMNS)
    .where('id', '=', id)
    .executeTakeFirst();
  return row ?? null;
}
