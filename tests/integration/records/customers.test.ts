import { afterAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { addContact, createCustomer, updateCustomer } from '@/lib/customers/mutations';
import { customerSchema } from '@/lib/customers/schemas';
import { inRolledBackTransaction, refusalOf, sessionUserByEmail, uniqueSuffix } from './helpers';

afterAll(() => db.destroy());

const form = (code: string) =>
  customerSchema.parse({
    code,
    name: `Test Anodic Works ${code}`,
    billingAddress: '1 Test Way',
    shippingAddress: '',
    billingEmail: 'ap@anodic.test',
    phone: '',
    paymentTermsDays: '45',
    taxRatePercent: '8.88',
  });


const count = (trx: typeof db, table: 'customers' | 'customer_contacts' | 'audit_log') =>
  trx.selectFrom(table).select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow().then((r) => r.n);

describe('customer schema', () => {
  it('refuses a tax rate with more than two decimals rather than rounding it', () => {
    const r = customerSchema.safeParse({ code: 'AB', name: 'x', paymentTermsDays: '30', taxRatePercent: '8.875' });
    expect(r.success).toBe(false);
    expect(r.error?.issues.map((i) => [i.path[0], i.message])).toEqual([['taxRatePercent', 'Enter the tax rate as a percentage with at most two decimals, e.g. 7.25.']]);
  });

  it('stores 7.25 % as 725 basis points exactly', () => {
    expect(customerSchema.parse({ code: 'ab', name: 'x', paymentTermsDays: '30', taxRatePercent: '7.25' })).toMatchObject({ code: 'AB', taxRatePercent: 725 });
  });
});

describe('customers', () => {
  const valid = () => form('XX');

  it('creates and updates a customer, with an audit line each', async () => {
    await inRolledBackTransaction(async (trx) => {
      const estimator = await sessionUserByEmail('estimator@kestrel-plating.test');
      const code = `T${uniqueSuffix()}`.slice(0, 16);
      const { customerId } = await createCustomer(estimator, { ...valid(), code }, trx);
      await updateCustomer(estimator, { ...valid(), code, name: 'Renamed Works', customerId }, trx);
      const row = await trx.selectFrom('customers').selectAll().where('id', '=', customerId).executeTakeFirstOrThrow();
      expect(row).toMatchObject({ code, name: 'Renamed Works', payment_terms_days: 45, tax_rate_bp: 888, billing_email: 'ap@anodic.test' });
      const audit = await trx.selectFrom('audit_log').select('action').where('entity_id', '=', customerId).orderBy('id').execute();
      expect(audit.map((a) => a.action)).toEqual(['customer.create', 'customer.update']);
    });
  });

  it('refuses a plater, a duplicate code and an unknown customer, writing nothing', async () => {
    await inRolledBackTransaction(async (trx) => {
      const [plater, owner] = await Promise.all([sessionUserByEmail('plater@kestrel-plating.test'), sessionUserByEmail('owner@kestrel-plating.test')]);
      const before = await Promise.all([count(trx, 'customers'), count(trx, 'audit_log')]);
      expect(await refusalOf(createCustomer(plater, { ...valid(), code: 'PLATERTRY' }, trx))).toBe('FORBIDDEN: You are not allowed to do this.');
      expect(await refusalOf(createCustomer(owner, { ...valid(), code: 'NGF' }, trx))).toBe(
        'CONFLICT: Check the highlighted field. {"code":["Another customer already uses the code NGF."]}',
      );
      expect(await refusalOf(updateCustomer(owner, { ...valid(), code: 'ZZZ', customerId: '00000000-0000-4000-8000-000000000000' }, trx))).toBe(
        'NOT_FOUND: That customer does not exist.',
      );
      expect(await Promise.all([count(trx, 'customers'), count(trx, 'audit_log')])).toEqual(before);
    });
  });

  it('adds a contact, and refuses a second contact with the same e-mail', async () => {
    await inRolledBackTransaction(async (trx) => {
      const owner = await sessionUserByEmail('owner@kestrel-plating.test');
      const { customerId } = await createCustomer(owner, { ...valid(), code: `C${uniqueSuffix()}`.slice(0, 16) }, trx);
      const contact = { customerId, name: 'Pat Lindqvist', email: 'pat@anodic.test', phone: '', isBilling: true, maySignIn: false };
      const { invited } = await addContact(owner, contact, trx);
      expect(invited).toBe(false);
      const before = await count(trx, 'customer_contacts');
      expect(await refusalOf(addContact(owner, { ...contact, name: 'Pat again' }, trx))).toMatch(/already has a contact with that e-mail/);
      expect(await refusalOf(addContact(owner, { ...contact, customerId: '00000000-0000-4000-8000-000000000000' }, trx))).toBe('NOT_FOUND: That customer does not exist.');
      expect(await count(trx, 'customer_contacts')).toBe(before);
    });
  });

  it('invites a contact who may sign in as a customer user of that customer only', async () => {
    const email = `contact-${uniqueSuffix().toLowerCase()}@anodic.test`;
    try {
      await inRolledBackTransaction(async (trx) => {
        const owner = await sessionUserByEmail('owner@kestrel-plating.test');
        const ngf = (await trx.selectFrom('customers').select('id').where('code', '=', 'NGF').executeTakeFirstOrThrow()).id;
        const { contactId, invited } = await addContact(owner, { customerId: ngf, name: 'Sam Ortega', email, phone: '', isBilling: false, maySignIn: true }, trx);
        expect(invited).toBe(true);
        const user = await db.selectFrom('users').select(['id', 'role', 'customer_id', 'password_hash']).where('email', '=', email).executeTakeFirstOrThrow();
        expect(user).toMatchObject({ role: 'customer', customer_id: ngf, password_hash: null });
        const link = await trx.selectFrom('customer_contacts').select('user_id').where('id', '=', contactId).executeTakeFirstOrThrow();
        expect(link.user_id).toBe(user.id);
      });
    } finally {
      await db.deleteFrom('users').where('email', '=', email).execute();
    }
  });
});
