// Tables of migration 2026_12_01_2250_create_billing.
import type { Generated, Selectable } from 'kysely';
import type { DateColumn, Json, Numeric, Timestamp, TimestampNullable } from './columns';

export type InvoiceStatus = 'issued' | 'partly_paid' | 'paid' | 'overpaid' | 'credited';
export type InvoiceLineKind = 'work_order' | 'rush' | 'expedite' | 'rework' | 'other';
export type PaymentKind = 'payment' | 'refund';
export type PaymentMethod = 'card' | 'check' | 'bank_transfer';
export type ReminderStage = 'overdue_1' | 'overdue_15' | 'overdue_30' | 'overdue_60';

export type InvoicesTable = {
  id: Generated<string>;
  number: string;
  customer_id: string;
  status: Generated<InvoiceStatus>;
  issued_on: DateColumn;
  due_on: DateColumn;
  payment_terms_days: number;
  tax_rate_bp: number;
  currency: Generated<string>;
  subtotal_cents: number;
  tax_cents: number;
  total_cents: number;
  paid_cents: Generated<number>;
  credited_cents: Generated<number>;
  bill_to_name: string;
  bill_to_address: Generated<string>;
  billing_email: string | null;
  notes: Generated<string>;
  rounding_rule: string;
  issued_by: string | null;
  emailed_at: TimestampNullable;
  created_at: Timestamp;
  updated_at: Timestamp;
};

export type InvoiceLinesTable = {
  id: Generated<string>;
  invoice_id: string;
  line_no: number;
  kind: InvoiceLineKind;
  work_order_id: string | null;
  description: string;
  quantity: Numeric;
  unit: string;
  unit_price_cents: Numeric;
  amount_cents: number;
};

export type CreditNotesTable = {
  id: Generated<string>;
  number: string;
  invoice_id: string;
  customer_id: string;
  amount_cents: number;
  reason: string;
  issued_on: DateColumn;
  issued_by: string | null;
  created_at: Timestamp;
};

export type PaymentsTable = {
  id: Generated<string>;
  invoice_id: string;
  customer_id: string;
  kind: PaymentKind;
  method: PaymentMethod;
  amount_cents: number;
  currency: Generated<string>;
  received_at: Timestamp;
  reference: Generated<string>;
  stripe_payment_intent_id: string | null;
  stripe_charge_id: string | null;
  stripe_refund_key: string | null;
  recorded_by: string | null;
  created_at: Timestamp;
};

export type StripeEventsTable = {
  id: string;
  type: string;
  invoice_id: string | null;
  outcome: string;
  stripe_created_at: Timestamp;
  received_at: Timestamp;
};

export type InvoiceCheckoutsTable = {
  id: string;
  invoice_id: string;
  customer_id: string;
  amount_cents: number;
  url: string;
  expires_at: Timestamp;
  created_by: string | null;
  created_at: Timestamp;
};

export type InvoiceRemindersTable = {
  invoice_id: string;
  stage: ReminderStage;
  sent_to: string;
  sent_at: Timestamp;
};

// Tables of migration 2026_12_03_0900_create_payment_exceptions.
export type CreditApplicationsTable = {
  id: Generated<string>;
  customer_id: string;
  from_invoice_id: string;
  to_invoice_id: string;
  amount_cents: number;
  note: Generated<string>;
  applied_by: string | null;
  created_at: Timestamp;
};

export type PaymentExceptionReason =
  | 'amount_differs'
  | 'wrong_currency'
  | 'unknown_invoice'
  | 'other_customer'
  | 'credited_invoice'
  | 'already_paid'
  | 'overpaid'
  | 'refund_exceeds_payments';

export type PaymentExceptionsTable = {
  id: Generated<string>;
  reason: PaymentExceptionReason;
  message: string;
  amount_cents: number;
  currency: string;
  invoice_id: string | null;
  customer_id: string | null;
  payment_id: string | null;
  source: 'stripe' | 'office';
  stripe_event_id: string | null;
  stripe_payment_intent_id: string | null;
  payload: Json<Record<string, unknown>>;
  status: Generated<'open' | 'resolved'>;
  resolution: string | null;
  resolved_by: string | null;
  resolved_at: TimestampNullable;
  owner_notified_at: TimestampNullable;
  created_at: Timestamp;
};

export type BillingTables = {
  credit_applications: CreditApplicationsTable;
  payment_exceptions: PaymentExceptionsTable;
  invoices: InvoicesTable;
  invoice_lines: InvoiceLinesTable;
  credit_notes: CreditNotesTable;
  payments: PaymentsTable;
  stripe_events: StripeEventsTable;
  invoice_checkouts: InvoiceCheckoutsTable;
  invoice_reminders: InvoiceRemindersTable;
};

export type Invoice = Selectable<InvoicesTable>;
export type InvoiceLine = Selectable<InvoiceLinesTable>;
export type CreditNote = Selectable<CreditNotesTable>;
export type Payment = Selectable<PaymentsTable>;
export type PaymentException = Selectable<PaymentExceptionsTable>;
