// Starts the built app (`next start`, built into .next-test by the test command) against the test
// database, once for all browser tests, and stops it afterwards.
import { startAppServer } from './app-server';
import { prepareTestDatabase, TEST_DATABASE_URL } from './test-db';

export const E2E_PORT = Number(process.env.APP_PORT ?? 3100);
export const E2E_URL = `http://127.0.0.1:${E2E_PORT}`;

export default async function setup(): Promise<() => Promise<void>> {
  await prepareTestDatabase();
  const server = await startAppServer({ port: E2E_PORT, databaseUrl: TEST_DATABASE_URL });
  return () => server.stop();
}
