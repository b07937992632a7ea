// Our own customer, parts and contacts for quote and work-order tests, with unique names per run,
// beside the seeded demo shop (its finishes, tanks and rates) and its staff.
import { db } from '@/db';
import type { Role } from '@/db/types';
import { AppError } from '@/lib/errors';
import type { Actor } from '@/lib/quotes/access';

export function suffix(): string {
  return `${Date.now().toString(36)}${Math.floor(Math.random() * 1e5).toString(36)}`.toUpperCase().slice(-9);
}

export async function staff(role: Exclude<Role, 'customer'>): Promise<Actor> {
  const u = await db.selectFrom('users').select(['id', 'role', 'customer_id', 'name', 'email']).where('email', '=', `${role}@kestrel-plating.test`).executeTakeFirstOrThrow();
  return { id: u.id, role: u.role, customerId: u.customer_id, name: u.name, email: u.email };
}

export type TestCustomer = {
  id: string;
  code: string;
  contact: Actor;
  parts: { screw: string; stem: string; noWeight: string };
};

/** A fresh customer with one sign-in contact and three parts. */
export async function makeCustomer(): Promise<TestCustomer> {
  const s = suffix();
  const code = `TQ${s}`.slice(0, 16);
  const c = await db.insertInto('customers').values({ code, name: `Test Quotes ${s}` }).returning('id').executeTakeFirstOrThrow();
  const userId = `test-quotes-${s.toLowerCase()}`;
  const email = `buyer-${s.toLowerCase()}@quotes.test`;
  await db.insertInto('users').values({ id: userId, email, name: `Buyer ${s}`, role: 'customer', customer_id: c.id }).execute();
  const part = (part_number: string, v: { area_dm2: number; weight_g: number | null; hardness_hrc: number | null; tensile_mpa: number | null }) =>
    db.insertInto('parts').values({ customer_id: c.id, part_number, revision: 'A', description: `Test part ${part_number}`, substrate: 'carbon-steel', ...v }).returning('id').executeTakeFirstOrThrow();
  const [screw, stem, noWeight] = await Promise.all([
    part('SCREW', { area_dm2: 0.172, weight_g: 31.5, hardness_hrc: 39, tensile_mpa: 1220 }),
    part('STEM', { area_dm2: 1.32, weight_g: 540, hardness_hrc: null, tensile_mpa: 650 }),
    part('PLATE', { area_dm2: 0.5, weight_g: null, hardness_hrc: null, tensile_mpa: null }),
  ]);
  return {
    id: c.id,
    code,
    contact: { id: userId, role: 'customer', customerId: c.id, name: `Buyer ${s}`, email },
    parts: { screw: screw.id, stem: stem.id, noWeight: noWeight.id },
  };
}

export async function finishId(code: string): Promise<string> {
  return (await db.selectFrom('finishes').select('id').where('code', '=', code).executeTakeFirstOrThrow()).id;
}

/** "CODE: message" of what a call threw, or "none". */
export async function outcome(p: Promise<unknown>): Promise<string> {
  try {
    await p;
    return 'none';
  } catch (e) {
    return e instanceof AppError ? `${e.code}: ${e.message}` : `unexpected: ${String(e)}`;
  }
}
