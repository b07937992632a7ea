// One-time codes for test sign-ins, computed from the account's key as an authenticator app
// would (RFC 6238). A code is accepted once, so this picks the first 30-second step after the
// last one the account used, waiting for the clock when the current steps are spent.
import pg from 'pg';
import { Secret, TOTP } from 'otpauth';
import { TEST_DATABASE_URL } from './test-db';

export async function nextCodeFor(email: string): Promise<string> {
  const client = new pg.Client({ connectionString: TEST_DATABASE_URL });
  await client.connect();
  try {
    const { rows } = await client.query<{ totp_secret: string | null; totp_last_step: string | null }>(
      'select totp_secret, totp_last_step from users where email = $1',
      [email],
    );
    const row = rows[0];
    if (!row?.totp_secret) throw new Error(`${email} has no second factor`);
    const totp = new TOTP({ algorithm: 'SHA1', digits: 6, period: 30, secret: Secret.fromBase32(row.totp_secret) });
    const last = row.totp_last_step === null ? -Infinity : Number(row.totp_last_step);
    for (;;) {
      const now = Math.floor(Date.now() / 1000 / 30);
      // the server accepts one step of drift either way; stay within [now, now + 1]
      const step = Math.max(now, last + 1);
      if (step <= now + 1) return totp.generate({ timestamp: step * 30_000 });
      await new Promise((r) => setTimeout(r, 1000));
    }
  } finally {
    await client.end();
  }
}
