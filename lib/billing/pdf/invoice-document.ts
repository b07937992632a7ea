// The invoice document built with the renderer imported statically, as the app (bundled by Next) uses it.
import * as ReactPdf from '@react-pdf/renderer';
import { makeInvoiceDocument } from './invoice-layout';

export type { InvoicePdfData, InvoicePdfLine } from './invoice-layout';

export const InvoiceDocument = makeInvoiceDocument(ReactPdf);
