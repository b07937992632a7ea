// Backup and restore: a dump of the seeded test database restored into a new, empty database
// holds the same rows (counts and a checksum per table).
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { afterAll, describe, expect, it } from 'vitest';

const url = process.env.DATABASE_URL!;
const restoredName = `ampwright_restore_${process.pid}`;
const restoredUrl = `${url.slice(0, url.lastIndexOf('/'))}/${restoredName}`;
const script = path.resolve(__dirname, '../../docker-free-scripts/backup.sh');
const dir = mkdtempSync(path.join(os.tmpdir(), 'ampwright-backup-'));

async function fingerprint(connectionString: string): Promise<Record<string, string>> {
  const client = new pg.Client({ connectionString });
  await client.connect();
  try {
    const tables = await client.query<{ t: string }>(
      "select table_name as t from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE' order by 1",
    );
    const out: Record<string, string> = {};
    for (const { t } of tables.rows) {
      // Row count and an order-independent checksum of every row's text form.
      const r = await client.query<{ n: string; h: string | null }>(
        `select count(*)::text as n, md5(string_agg(md5(x::text), '' order by md5(x::text))) as h from "${t}" x`,
      );
      out[t] = `${r.rows[0]!.n}:${r.rows[0]!.h ?? ''}`;
    }
    return out;
  } finally {
    await client.end();
  }
}

afterAll(async () => {
  rmSync(dir, { recursive: true, force: true });
  const admin = new pg.Client({ connectionString: `${url.slice(0, url.lastIndexOf('/'))}/postgres` });
  await admin.connect();
  await admin.query(`drop database if exists "${restoredName}" with (force)`);
  await admin.end();
});

describe('backup and restore', () => {
  it('restores a seeded dump into an empty database with identical row counts and checksums', async () => {
    const file = path.join(dir, 'seeded.dump');
    execFileSync('bash', [script, 'dump', file], { env: { ...process.env, DATABASE_URL: url }, stdio: 'pipe' });
    execFileSync('bash', [script, 'restore', file, restoredName], { env: { ...process.env, DATABASE_URL: url }, stdio: 'pipe' });
    const [before, after] = await Promise.all([fingerprint(url), fingerprint(restoredUrl)]);
    expect(Object.keys(after).length).toBeGreaterThan(10);
    expect(after).toEqual(before);
    expect(Number(after.users!.split(':')[0])).toBeGreaterThanOrEqual(6);
  });

  it('refuses to restore over an existing database', () => {
    expect(() =>
      execFileSync('bash', [script, 'restore', path.join(dir, 'seeded.dump'), restoredName], { env: { ...process.env, DATABASE_URL: url }, stdio: 'pipe' }),
    ).toThrow(/already exists/);
  });
});
