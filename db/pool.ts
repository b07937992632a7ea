// One pg Pool per process. Kept free of `server-only` so scripts (tsx) and tests can import it.
import pg from 'pg';

// pg returns int8 and numeric as strings; our int8 values (ids, cents) stay far below 2^53.
pg.types.setTypeParser(20, (v) => Number(v));
pg.types.setTypeParser(1700, (v) => Number(v));
// A date column is a calendar day: UTC midnight of that day, whatever the server's own zone.
pg.types.setTypeParser(1082, (v) => new Date(`${v}T00:00:00Z`));

export function databaseUrl(): string {
  return process.env.DATABASE_URL ?? 'postgres://app@127.0.0.1:54329/ampwright';
}

export function createPool(url = databaseUrl()): pg.Pool {
  const pool = new pg.Pool({
    connectionString: url,
    max: Number(process.env.DATABASE_POOL_MAX ?? 10),
    // Fail fast when the database is down, so a request answers 503 instead of hanging.
    connectionTimeoutMillis: 3000,
    idleTimeoutMillis: 30_000,
    statement_timeout: 15_000,
  });
  // A client losing its connection (database stopped or restarted) must not crash the process:
  // the pool reports idle ones; a checked-out one reports on itself, and the query that was using
  // it fails (503). Either way the pool drops the client and connects afresh when the database is back.
  pool.on('error', (err) => console.error('[db] idle client error:', err.message));
  pool.on('connect', (client) => client.on('error', (err) => console.error('[db] client error:', err.message)));
  return pool;
}
