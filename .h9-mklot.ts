import { createDb } from './db/kysely';
import { createPool } from './db/pool';
import { createLot } from './tests/integration/quality/fixtures';
async function main() {
  const db = createDb(createPool(process.env.DATABASE_URL));
  const bake = await createLot(db, { bake: true, quantity: 60, platingEnd: new Date(Date.now() - 3.2 * 3600_000) });
  const bake2 = await createLot(db, { bake: true, quantity: 24, platingEnd: new Date(Date.now() - 1.0 * 3600_000) });
  const plain = await createLot(db, { quantity: 20 });
  console.log(bake.id, bake2.id, plain.id);
  await db.destroy();
}
main();
