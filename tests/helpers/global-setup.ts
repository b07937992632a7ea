import { prepareTestDatabase } from './test-db';

export default async function setup(): Promise<void> {
  await prepareTestDatabase();
}
