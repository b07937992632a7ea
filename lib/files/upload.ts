import 'server-only';
// Uploads arrive as a raw request body (no multipart), so large STL models stream straight into
// the hash and the STL parser: POST /api/files?purpose=stl&unit=mm&substrate=carbon-steel with
// the file name in the `x-file-name` header (URI-encoded) and the browser's type in content-type.
import type { SessionUser } from '@/lib/auth/current-user';
import { type Permission, roleCan } from '@/lib/auth/roles';
import { AppError } from '@/lib/errors';
import { SUBSTRATES, type StlUnit } from '@/lib/plating';
import { FILE_KINDS, type FileKind, formatBytes, sizeLimit } from './sniff';
import { storeFile, type StoredFile } from './store';

export type UploadPurpose = { allowed: readonly FileKind[]; permission: Permission; label: string };

/** What may be uploaded for what. Another area adds its own purpose here (one line). */
export const UPLOAD_PURPOSES = {
  drawing: { allowed: FILE_KINDS.drawing, permission: 'customers.write', label: 'a part drawing' },
  stl: { allowed: FILE_KINDS.stl, permission: 'customers.write', label: 'a part model (STL)' },
  'receipt-photo': { allowed: FILE_KINDS.image, permission: 'dock.receive', label: 'a receiving photo' },
  'oven-chart': { allowed: ['pdf', 'png', 'jpeg', 'webp', 'csv', 'text'], permission: 'quality.record', label: 'an oven chart' },
} as const satisfies Record<string, UploadPurpose>;

export type UploadPurposeId = keyof typeof UPLOAD_PURPOSES;

function purposeOf(id: string | null): UploadPurpose {
  if (id && Object.hasOwn(UPLOAD_PURPOSES, id)) return UPLOAD_PURPOSES[id as UploadPurposeId];
  throw new AppError('BAD_INPUT', `Say what the upload is for: purpose must be one of ${Object.keys(UPLOAD_PURPOSES).join(', ')}.`);
}

function headerName(req: Request): string {
  const raw = req.headers.get('x-file-name');
  if (!raw) throw new AppError('BAD_INPUT', 'The file name is missing (x-file-name header).');
  try {
    return decodeURIComponent(raw);
  } catch {
    throw new AppError('BAD_INPUT', 'The file name is not valid (x-file-name must be URI-encoded).');
  }
}

function stlOptions(params: URLSearchParams): { unit: StlUnit; densityGPerCm3?: number } {
  const unit = params.get('unit') ?? 'mm';
  if (unit !== 'mm' && unit !== 'in') throw new AppError('BAD_INPUT', 'The STL unit must be mm or in.', { unit: ['Choose mm or in.'] });
  const substrate = params.get('substrate');
  if (!substrate) return { unit };
  if (!Object.hasOwn(SUBSTRATES, substrate)) throw new AppError('BAD_INPUT', `Unknown substrate "${substrate}".`);
  return { unit, densityGPerCm3: SUBSTRATES[substrate as keyof typeof SUBSTRATES].densityGPerCm3 };
}

export type UploadAnswer = { file: Omit<StoredFile, 'createdAt'> & { createdAt: string; url: string } };

/** Reads, checks and stores the request body as a file for `user`. */
export async function receiveUpload(req: Request, user: SessionUser): Promise<UploadAnswer> {
  const params = new URL(req.url).searchParams;
  const purpose = purposeOf(params.get('purpose'));
  if (!roleCan(user.role, purpose.permission)) throw new AppError('FORBIDDEN', `You are not allowed to upload ${purpose.label}.`);
  const name = headerName(req);
  const limit = sizeLimit(purpose.allowed);
  // Refuse early when the client says the body is too big; the stream check catches the rest.
  const declaredLength = Number(req.headers.get('content-length') ?? 0);
  if (declaredLength > limit) throw new AppError('TOO_LARGE', `"${name}" is larger than the ${formatBytes(limit)} limit for ${purpose.label}.`);
  const stored = await storeFile({
    name,
    stream: req.body,
    declaredType: req.headers.get('content-type'),
    allowed: purpose.allowed,
    uploadedBy: user.id,
    stl: purpose.allowed.includes('stl') ? stlOptions(params) : undefined,
  });
  return { file: { ...stored, createdAt: stored.createdAt.toISOString(), url: `/api/files/${stored.id}` } };
}
