import 'server-only';
// E-mails from the dock to the customer: a receiving discrepancy, and each shipment with its
// packing slip and certificate. Sent after the record is saved; a failed send leaves the record
// unmarked so the screen offers to send again. Nothing here throws.
import { db } from '@/db';
import { appUrl, sendEmail } from '@/lib/email/mailer';
import { readFile } from '@/lib/files/store';
import { formatDateTime } from '@/lib/quotes/format';
import { getShopSettings } from '@/lib/users/queries';
import { DISCREPANCY_LABELS, DISCREPANCY_SHORT } from './schemas';
import { formatWeight } from './packing-slip-pdf';
import { packingSlipFilename } from './shipping';

export type NoticeResult = { ok: boolean; to: string | null; message: string };

/** Where dock notices go: the customer's contacts with an address, else its billing address. */
export async function customerNoticeAddresses(customerId: string): Promise<string[]> {
  const [contacts, customer] = await Promise.all([
    db.selectFrom('customer_contacts').select('email').where('customer_id', '=', customerId).where('email', 'is not', null).orderBy('created_at').execute(),
    db.selectFrom('customers').select('billing_email').where('id', '=', customerId).executeTakeFirst(),
  ]);
  const list = [...new Set(contacts.map((c) => c.email!.toLowerCase()))];
  if (list.length) return list;
  return customer?.billing_email ? [customer.billing_email] : [];
}

const noAddress = (name: string): NoticeResult => ({ ok: false, to: null, message: `${name} has no contact e-mail address on record; add one to the customer and send again.` });

export async function sendDiscrepancyNotice(receiptId: string): Promise<NoticeResult> {
  const r = await db
    .selectFrom('receipts as r')
    .innerJoin('work_orders as w', 'w.id', 'r.work_order_id')
    .innerJoin('customers as c', 'c.id', 'r.customer_id')
    .innerJoin('parts as p', 'p.id', 'w.part_id')
    .select(['r.id', 'r.number', 'r.received_at', 'r.quantity', 'r.containers', 'r.weight_kg', 'r.discrepancy', 'r.discrepancy_note', 'r.condition_note', 'r.customer_lot', 'r.customer_part_number',
      'r.customer_id', 'w.id as work_order_id', 'w.number as work_order_number', 'w.po_number', 'w.quantity_ordered', 'c.name as customer_name', 'p.part_number', 'p.revision'])
    .where('r.id', '=', receiptId)
    .executeTakeFirst();
  if (!r) return { ok: false, to: null, message: 'That receipt does not exist.' };
  if (r.discrepancy === 'none') return { ok: false, to: null, message: 'This receipt has no discrepancy to report.' };
  const to = await customerNoticeAddresses(r.customer_id);
  if (!to.length) return noAddress(r.customer_name);
  const shop = await getShopSettings();
  const photos = await db.selectFrom('receipt_photos').select((eb) => eb.fn.countAll<number>().as('n')).where('receipt_id', '=', r.id).executeTakeFirstOrThrow();
  const sent = await sendEmail({
    to: to.join(', '),
    template: 'receiving-discrepancy',
    subject: `Receiving discrepancy on PO ${r.po_number}: ${DISCREPANCY_SHORT[r.discrepancy].toLowerCase()}`,
    text: [
      'Hello,',
      '',
      `Your parts for PO ${r.po_number} arrived on ${formatDateTime(r.received_at)} and we found a discrepancy.`,
      '',
      `Discrepancy: ${DISCREPANCY_LABELS[r.discrepancy]}`,
      r.discrepancy_note,
      '',
      `Part: ${r.part_number}${r.revision ? ` rev ${r.revision}` : ''}${r.customer_part_number ? ` (your part ${r.customer_part_number})` : ''}${r.customer_lot ? `, your lot ${r.customer_lot}` : ''}`,
      `Counted: ${r.quantity.toLocaleString('en-US')} parts in ${r.containers} container(s), ${formatWeight(r.weight_kg)}; ordered ${r.quantity_ordered.toLocaleString('en-US')}.`,
      r.condition_note ? `Condition: ${r.condition_note}` : '',
      Number(photos.n) > 0 ? `${photos.n} photo(s) are on the order in the portal.` : '',
      '',
      `Our receipt ${r.number}, work order ${r.work_order_number}: ${appUrl(`/portal/orders/${r.work_order_id}`)}`,
      'Please reply to tell us how you would like us to proceed.',
      '',
      shop?.name ?? '',
    ].filter((l, i, a) => l !== '' || a[i - 1] !== '').join('\n'),
  });
  if (!sent.ok) return { ok: false, to: to.join(', '), message: `The discrepancy could not be e-mailed to ${to.join(', ')}. The receipt is saved; send it again from the order.` };
  await db.updateTable('receipts').set({ discrepancy_emailed_at: new Date() }).where('id', '=', r.id).execute();
  return { ok: true, to: to.join(', '), message: `Discrepancy e-mailed to ${to.join(', ')}.` };
}

export async function sendShipmentNotice(shipmentId: string): Promise<NoticeResult> {
  const s = await db
    .selectFrom('shipments as s')
    .innerJoin('work_orders as w', 'w.id', 's.work_order_id')
    .innerJoin('customers as c', 'c.id', 's.customer_id')
    .innerJoin('parts as p', 'p.id', 'w.part_id')
    .leftJoin('certificates as cc', 'cc.id', 's.certificate_id')
    .select(['s.id', 's.number', 's.shipped_at', 's.quantity', 's.containers', 's.carrier', 's.tracking_number', 's.slip_file_id', 's.customer_id', 'w.id as work_order_id', 'w.number as work_order_number',
      'w.po_number', 'c.name as customer_name', 'p.part_number', 'p.revision', 'cc.number as certificate_number', 'cc.pdf_file_id as certificate_file_id'])
    .where('s.id', '=', shipmentId)
    .executeTakeFirst();
  if (!s) return { ok: false, to: null, message: 'That shipment does not exist.' };
  const to = await customerNoticeAddresses(s.customer_id);
  if (!to.length) return noAddress(s.customer_name);
  const [slip, cert, shop] = await Promise.all([readFile(s.slip_file_id), s.certificate_file_id ? readFile(s.certificate_file_id) : null, getShopSettings()]);
  const attachments = [{ filename: packingSlipFilename(s.number), content: slip!.bytes, contentType: 'application/pdf' }];
  if (cert && s.certificate_number) attachments.push({ filename: `certificate-${s.certificate_number}.pdf`, content: cert.bytes, contentType: 'application/pdf' });
  const sent = await sendEmail({
    to: to.join(', '),
    template: 'shipment',
    subject: `Shipped: ${s.quantity.toLocaleString('en-US')} parts on PO ${s.po_number} (${s.number})`,
    text: [
      'Hello,',
      '',
      `We shipped ${s.quantity.toLocaleString('en-US')} parts ${s.part_number}${s.revision ? ` rev ${s.revision}` : ''} on PO ${s.po_number} on ${formatDateTime(s.shipped_at)}, in ${s.containers} container(s).`,
      `Carrier: ${s.carrier}${s.tracking_number ? `, tracking ${s.tracking_number}` : ''}.`,
      '',
      `Attached: packing slip ${s.number}${s.certificate_number ? ` and certificate of conformance ${s.certificate_number}` : ''}.`,
      `The order in the portal: ${appUrl(`/portal/orders/${s.work_order_id}`)}`,
      '',
      shop?.name ?? '',
    ].join('\n'),
    attachments,
  });
  if (!sent.ok) return { ok: false, to: to.join(', '), message: `The shipment could not be e-mailed to ${to.join(', ')}. It is recorded; send it again from the order.` };
  await db.updateTable('shipments').set({ emailed_at: new Date(), email_to: to.join(', ') }).where('id', '=', s.id).execute();
  return { ok: true, to: to.join(', '), message: `Packing slip${s.certificate_number ? ' and certificate' : ''} e-mailed to ${to.join(', ')}.` };
}
