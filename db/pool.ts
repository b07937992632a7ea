// One pg Pool per process. Kept free of `server-only` so scripts (tsx) and tests can import it.
import pg from 'pg';

// pg returns int8 and numeric as strings; our int8 values (ids, cents) stay far below 2^53.
pg.types.setTypeParser(20, (v) => Number(v));
pg.types.setTypeParser(1700, (v) => Number(v));

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
  // An idle client losing its connection (database restart) must not crash the process.
  pool.on('error', (err) => console.error('[db] idle client error:', err.message));
  return pool;
}
