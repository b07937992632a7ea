import 'server-only';
// Issuing a certificate of conformance: only a supervisor (or the owner), only when every
// required record is present and passing, once per order. The content and its PDF are stored when
// issued and never change (the table refuses updates and deletes).
import type { Kysely } from 'kysely';
import { db } from '@/db';
import type { Database } from '@/db/types';
import { ROLE_LABELS } from '@/lib/auth/roles';
import { AppError } from '@/lib/errors';
import { fileDownloadResponse } from '@/lib/files/download';
import { readFile, storeFile } from '@/lib/files/store';
import { nextDocumentNumber } from '@/lib/quotes/numbering';
import type { SessionUser } from '@/lib/auth/current-user';
import { type Actor, audit, lockOrder, requireActor } from '../access';
import { bathSnapshot } from './bath-snapshot';
import { buildCertificateContent, type CertificateContent, type ShopDetails } from './content';
import { renderCertificatePdf } from './pdf';
import { certificateChecks } from '../lot-checks';
import { loadLot } from '../lot';
import { shopTimeZone } from '../shop-time';

export const NOT_SUPERVISOR = 'Only a supervisor may issue a certificate of conformance.';

async function shopDetails(trx: Parameters<typeof loadLot>[0]): Promise<ShopDetails> {
  const row = await trx.selectFrom('settings').select('value').where('key', '=', 'shop').executeTakeFirst();
  const v = (row?.value ?? {}) as Partial<ShopDetails>;
  return { name: v.name ?? 'Our shop', address: v.address ?? '', phone: v.phone ?? '', email: v.email ?? '' };
}

export type IssuedCertificate = { id: string; number: string; pdfFileId: string; content: CertificateContent };

export async function issueCertificate(
  actor: Actor,
  workOrderId: string,
  now: Date = new Date(),
  database: Kysely<Database> = db,
): Promise<IssuedCertificate> {
  requireActor(actor, 'certificates.issue', NOT_SUPERVISOR);
  return database.transaction().execute(async (trx) => {
    const order = await lockOrder(trx, workOrderId);
    const lot = (await loadLot(trx, order.id))!;
    if (lot.certificate) {
      throw new AppError('CONFLICT', `Certificate ${lot.certificate.number} was already issued for this order; an issued certificate cannot be changed.`);
    }
    const all = certificateChecks(lot).filter((c) => !c.ok);
    // The order cannot pass inspection while a record fails, so those come first; the inspection
    // step itself is named once every record is in order.
    const records = all.filter((c) => c.key !== 'inspected');
    const failing = records.length ? records : all;
    if (failing.length) {
      const messages = failing.filter((c) => !(c.key === 'thickness_pass' && lot.readings.length === 0)).map((c) => c.message);
      throw new AppError('CONFLICT', `The certificate cannot be issued yet. ${messages.join(' ')}`);
    }
    const number = await nextDocumentNumber(trx, 'certificate', now);
    const content = buildCertificateContent(lot, {
      number,
      signedAt: now,
      signer: { name: actor.name, role: ROLE_LABELS[actor.role] },
      shop: await shopDetails(trx),
      bath: await bathSnapshot(trx, lot.runs),
      timeZone: shopTimeZone(),
    });
    const pdf = await renderCertificatePdf(content);
    const file = await storeFile({ name: `${number}.pdf`, bytes: pdf, declaredType: 'application/pdf', allowed: ['pdf'], uploadedBy: actor.id }, trx);
    const row = await trx
      .insertInto('certificates')
      .values({
        number,
        work_order_id: order.id,
        customer_id: lot.order.customerId,
        content: JSON.stringify(content),
        pdf_file_id: file.id,
        signed_by: actor.id,
        signed_by_name: actor.name,
        signed_at: now,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    await audit(trx, actor, 'quality.certificate.issue', 'work_order', order.id, { certificateId: row.id, number });
    return { id: row.id, number, pdfFileId: file.id, content };
  });
}

const CERT_COLUMNS = ['c.id', 'c.number', 'c.signed_at', 'c.signed_by_name', 'c.pdf_file_id', 'w.number as work_order_number', 'w.po_number', 'p.part_number', 'p.revision'] as const;

function certificatesQuery() {
  return db
    .selectFrom('certificates as c')
    .innerJoin('work_orders as w', 'w.id', 'c.work_order_id')
    .innerJoin('parts as p', 'p.id', 'w.part_id');
}

/** A customer contact's own certificates; the customer comes from the session, never the request. */
export async function findCustomerCertificates(user: SessionUser) {
  if (user.role !== 'customer' || !user.customerId) return [];
  return certificatesQuery().select(CERT_COLUMNS).where('c.customer_id', '=', user.customerId).orderBy('c.signed_at', 'desc').limit(500).execute();
}

/** One certificate of the customer's own, or null: another customer's id reads as not found. */
export async function getCustomerCertificate(user: SessionUser, certificateId: string) {
  if (user.role !== 'customer' || !user.customerId || !/^[0-9a-f-]{36}$/i.test(certificateId)) return null;
  const row = await certificatesQuery()
    .select([...CERT_COLUMNS, 'c.content'])
    .where('c.id', '=', certificateId)
    .where('c.customer_id', '=', user.customerId)
    .executeTakeFirst();
  return row ? { ...row, content: row.content as CertificateContent } : null;
}

/** The stored PDF of a certificate, for staff or (scoped) for its customer. */
export async function certificatePdfFor(user: SessionUser, certificateId: string) {
  if (!/^[0-9a-f-]{36}$/i.test(certificateId)) return null;
  let q = db.selectFrom('certificates').select(['pdf_file_id', 'number']).where('id', '=', certificateId);
  if (user.role === 'customer') {
    if (!user.customerId) return null;
    q = q.where('customer_id', '=', user.customerId);
  }
  const cert = await q.executeTakeFirst();
  if (!cert) return null;
  return readFile(cert.pdf_file_id);
}

/** The HTTP answer for a certificate's PDF: shown in the browser unless `?download=1`; 404 for a foreign or unknown id. */
export async function certificatePdfResponse(req: Request, user: SessionUser, certificateId: string): Promise<Response> {
  const file = await certificatePdfFor(user, certificateId);
  if (!file) throw new AppError('NOT_FOUND', 'That certificate does not exist.');
  return fileDownloadResponse(file, new URL(req.url).searchParams.get('download') !== '1');
}
