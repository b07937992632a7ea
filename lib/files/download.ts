import 'server-only';
import { contentDisposition } from '@/lib/grid/csv';
import type { FileRecord } from './store';

// Shown in the browser only for types that cannot run script; everything else downloads.
const INLINE_TYPES = new Set(['application/pdf', 'image/png', 'image/jpeg', 'image/gif', 'image/webp']);

/** The HTTP answer for a stored file: its recorded type, a safe file name, and no sniffing. */
export function fileDownloadResponse(file: FileRecord & { bytes: Buffer }, inline: boolean): Response {
  const showInline = inline && INLINE_TYPES.has(file.content_type);
  return new Response(new Uint8Array(file.bytes), {
    headers: {
      'content-type': file.content_type,
      'content-length': String(file.size_bytes),
      'content-disposition': contentDisposition(showInline ? 'inline' : 'attachment', file.name),
      'x-content-type-options': 'nosniff',
      // A stored file never runs script in our origin, even if opened directly.
      'content-security-policy': "default-src 'none'; img-src 'self'; style-src 'unsafe-inline'; sandbox",
      'cache-control': 'private, no-store',
      etag: `"${file.sha256}"`,
    },
  });
}
