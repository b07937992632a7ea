// The lines of an invoice: one per shipped work order, priced as the order was (its accepted unit
// price per its pricing basis, applied to the quantity shipped), plus extra lines. Pure.
import type { InvoiceLineKind, PricingBasis } from '@/db/types';
import { AppError } from '@/lib/errors';
import { PlatingInputError } from '@/lib/plating';
import { BASIS_UNITS, basisQuantity } from '@/lib/quotes/basis';
import { invoiceTotals, toFourPlaces, type InvoiceTotals } from './arithmetic';
import type { ExtraKind } from './extra-kinds';

export type InvoiceableOrder = {
  id: string;
  number: string;
  poNumber: string;
  quantityShipped: number;
  unitPriceCents: number;
  pricingBasis: PricingBasis;
  partNumber: string;
  partRevision: string;
  finishName: string;
  areaPerPartDm2: number;
  weightPerPartG: number | null;
  /** Parts per load as the order was priced; used only for the per-load basis. */
  partsPerLoad: number;
};

export type ExtraLine = { kind: ExtraKind; description: string; quantity: number; unitPriceCents: number };

export type DraftLine = {
  kind: InvoiceLineKind;
  workOrderId: string | null;
  description: string;
  quantity: number;
  unit: string;
  unitPriceCents: number;
};

/** How many pricing units the shipped quantity is, taken to 4 decimal places. */
export function shippedBasisQuantity(order: InvoiceableOrder): number {
  if (!Number.isInteger(order.quantityShipped) || order.quantityShipped <= 0) {
    throw new AppError('CONFLICT', `${order.number} has no shipped quantity on record, so there is nothing to bill.`);
  }
  if (order.pricingBasis === 'load' && !(order.partsPerLoad > 0)) {
    throw new AppError('CONFLICT', `${order.number} is priced per load but has no parts-per-load figure on record.`);
  }
  try {
    const units = basisQuantity(order.pricingBasis, {
      quantity: order.quantityShipped,
      areaPerPartDm2: order.areaPerPartDm2,
      weightPerPartG: order.weightPerPartG,
      loads: order.pricingBasis === 'load' ? Math.ceil(order.quantityShipped / order.partsPerLoad) : 0,
    });
    return toFourPlaces(units);
  } catch (err) {
    if (err instanceof PlatingInputError) throw new AppError('CONFLICT', `${order.number}: ${err.message}`);
    throw err;
  }
}

export function orderLine(order: InvoiceableOrder): DraftLine {
  const part = order.partRevision ? `${order.partNumber} rev ${order.partRevision}` : order.partNumber;
  return {
    kind: 'work_order',
    workOrderId: order.id,
    description: `${order.number} · PO ${order.poNumber} · ${part} · ${order.finishName} · ${order.quantityShipped.toLocaleString('en-US')} pc shipped`,
    quantity: shippedBasisQuantity(order),
    unit: BASIS_UNITS[order.pricingBasis],
    unitPriceCents: order.unitPriceCents,
  };
}

export function extraLine(extra: ExtraLine): DraftLine {
  const description = extra.description.trim();
  if (!description) throw new AppError('BAD_INPUT', 'Every extra line needs a description.');
  if (!(extra.quantity > 0)) throw new AppError('BAD_INPUT', `"${description}": the quantity must be more than zero.`);
  return {
    kind: extra.kind,
    workOrderId: null,
    description,
    quantity: toFourPlaces(extra.quantity),
    unit: 'each',
    // Rework is done at no charge: whatever price was typed, the line is zero.
    unitPriceCents: extra.kind === 'rework' ? 0 : extra.unitPriceCents,
  };
}

export type DraftInvoice = { lines: DraftLine[]; totals: InvoiceTotals };

export function draftInvoice(orders: readonly InvoiceableOrder[], extras: readonly ExtraLine[], taxRateBp: number): DraftInvoice {
  const lines = [...orders.map(orderLine), ...extras.map(extraLine)];
  if (lines.length > 500) throw new AppError('BAD_INPUT', 'An invoice can hold at most 500 lines.');
  return { lines, totals: invoiceTotals(lines, taxRateBp) };
}
