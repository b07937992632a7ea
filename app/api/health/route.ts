// GET /api/health — anyone: is the app up and can it reach its database?
import { sql } from 'kysely';
import { NextResponse } from 'next/server';
import { db } from '@/db';
import { DATABASE_UNAVAILABLE_MESSAGE } from '@/lib/errors';

export const dynamic = 'force-dynamic';

export async function GET() {
  try {
    await sql`select 1`.execute(db);
    return NextResponse.json({ ok: true, database: 'up' });
  } catch {
    return NextResponse.json({ ok: false, database: 'down', error: { code: 'UNAVAILABLE', message: DATABASE_UNAVAILABLE_MESSAGE } }, { status: 503 });
  }
}
