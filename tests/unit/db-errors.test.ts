// Which failures mean "the database cannot be reached" (answered 503) and which are ordinary
// errors (a bug or a constraint, never disguised as an outage).
import pg from 'pg';
import { describe, expect, it } from 'vitest';
import { isDatabaseUnavailable } from '@/db/errors';

const withCode = (message: string, code: string) => Object.assign(new Error(message), { code });

describe('isDatabaseUnavailable', () => {
  it('recognises a refused connection from a real pg client', async () => {
    // Port 1 on loopback: nothing listens there.
    const client = new pg.Client({ connectionString: 'postgres://app@127.0.0.1:1/none', connectionTimeoutMillis: 2000 });
    const err = await client.connect().then(() => null, (e: unknown) => e);
    expect(err).not.toBeNull();
    expect(isDatabaseUnavailable(err)).toBe(true);
  });

  it('recognises the server shutting down and the pool’s broken clients', () => {
    // SQLSTATE classes 57P (operator intervention) and 08 (connection exception): PostgreSQL
    // documentation, Appendix A "PostgreSQL Error Codes".
    expect(isDatabaseUnavailable(withCode('terminating connection due to administrator command', '57P01'))).toBe(true);
    expect(isDatabaseUnavailable(withCode('the database system is starting up', '57P03'))).toBe(true);
    expect(isDatabaseUnavailable(withCode('connection failure', '08006'))).toBe(true);
    // pg's own messages (node_modules/pg/lib/client.js) for a client whose connection broke.
    expect(isDatabaseUnavailable(new Error('Client has encountered a connection error and is not queryable'))).toBe(true);
    expect(isDatabaseUnavailable(new Error('Connection terminated unexpectedly'))).toBe(true);
    // Wrapped by a caller.
    expect(isDatabaseUnavailable(new Error('could not save', { cause: withCode('x', 'ECONNRESET') }))).toBe(true);
  });

  it('leaves other failures alone', () => {
    expect(isDatabaseUnavailable(withCode('duplicate key value violates unique constraint', '23505'))).toBe(false);
    expect(isDatabaseUnavailable(withCode('canceling statement due to statement timeout', '57014'))).toBe(false);
    expect(isDatabaseUnavailable(new TypeError('x is undefined'))).toBe(false);
    expect(isDatabaseUnavailable(undefined)).toBe(false);
  });
});
