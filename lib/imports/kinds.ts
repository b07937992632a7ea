import 'server-only';
import type { Kysely } from 'kysely';
import type { Database } from '@/db';
import type { SessionUser } from '@/lib/auth/current-user';
import { AppError } from '@/lib/errors';
import { FILE_KINDS } from '@/lib/files/sniff';
import { readUploadText } from '@/lib/files/store';
import { contentDisposition } from '@/lib/grid/csv';
import { CUSTOMER_IMPORT_COLUMNS, importCustomers } from './customers';
import { type ImportColumn, type ImportOutcome, templateCsv } from './csv-rows';
import { importParts, PART_IMPORT_COLUMNS } from './parts';

type ImportKind = { columns: readonly ImportColumn[]; run: (actor: SessionUser, text: string, q?: Kysely<Database>) => Promise<ImportOutcome> };

export const IMPORT_KINDS = {
  customers: { columns: CUSTOMER_IMPORT_COLUMNS, run: importCustomers },
  parts: { columns: PART_IMPORT_COLUMNS, run: importParts },
} as const satisfies Record<string, ImportKind>;

export type ImportKindId = keyof typeof IMPORT_KINDS;

export function importKind(id: string): ImportKind {
  if (Object.hasOwn(IMPORT_KINDS, id)) return IMPORT_KINDS[id as ImportKindId];
  throw new AppError('NOT_FOUND', 'There is no such import.');
}

const MAX_IMPORT_BYTES = 5 * 1024 * 1024;

/** POST body → checked text → import. Problems come back as a 422 with every row's messages. */
export async function receiveImport(req: Request, actor: SessionUser, kindId: string): Promise<Response> {
  const kind = importKind(kindId);
  const name = decodeURIComponent(req.headers.get('x-file-name') ?? `${kindId}.csv`);
  const { text } = await readUploadText({ name, stream: req.body, declaredType: req.headers.get('content-type'), allowed: FILE_KINDS.csv, maxBytes: MAX_IMPORT_BYTES });
  const outcome = await kind.run(actor, text);
  if (outcome.ok) return Response.json(outcome, { status: 201 });
  const rows = new Set(outcome.problems.map((p) => p.row)).size;
  return Response.json(
    { ok: false, error: { code: 'BAD_INPUT', message: `${rows} ${rows === 1 ? 'row has' : 'rows have'} problems. Nothing was imported; fix them and upload the file again.` }, problems: outcome.problems },
    { status: 422 },
  );
}

export function templateResponse(kindId: string): Response {
  const kind = importKind(kindId);
  return new Response(templateCsv(kind.columns), {
    headers: {
      'content-type': 'text/csv; charset=utf-8',
      'content-disposition': contentDisposition('attachment', `${kindId}-import-template.csv`),
      'x-content-type-options': 'nosniff',
    },
  });
}
