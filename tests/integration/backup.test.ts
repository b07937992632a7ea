// Backup and restore: a dump of a freshly seeded database, restored into a new, empty database,
// holds the same rows (counts and a checksum per table). The source is a database of its own so
// that no other test writes to it between the dump and the comparison.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { prepareTestDatabase } from '../helpers/test-db';

const server = process.env.DATABASE_URL!.slice(0, process.env.DATABASE_URL!.lastIndexOf('/'));
const sourceName = `ampwright_backup_src_${process.pid}`;
const url = `${server}/${sourceName}`;
const restoredName = `ampwright_restore_${process.pid}`;
const restoredUrl = `${server}/${restoredName}`;
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

async function admin(sqlText: string): Promise<void> {
  const client = new pg.Client({ connectionString: `${server}/postgres` });
  await client.connect();
  try {
    await client.query(sqlText);
  } finally {
    await client.end();
  }
}

beforeAll(async () => {
  await admin(`create database "${sourceName}"`);
  await prepareTestDatabase(url);
}, 120_000);

afterAll(async () => {
  rmSync(dir, { recursive: true, force: true });
  await admin(`drop database if exists "${restoredName}" with (force)`);
  await admin(`drop database if exists "${sourceName}" with (force)`);
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
