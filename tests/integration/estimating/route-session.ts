// Calls POST /api/v1/plating/estimate as a given user: a real Lucia session in the test database,
// handed to the route through a stand-in for next/headers' cookie jar. Test files mock next/headers
// with `vi.mock('next/headers', async () => (await import('./cookie-jar')).nextHeadersStandIn())`.
import { db } from '@/db';
import { lucia } from '@/lib/auth/lucia';
import { POST } from '@/app/api/v1/plating/estimate/route';
import { cookieJar } from './cookie-jar';
const created: string[] = [];

export async function signInAs(email: string | null): Promise<void> {
  if (email === null) {
    cookieJar.sessionId = null;
    return;
  }
  const user = await db.selectFrom('users').select('id').where('email', '=', email).executeTakeFirstOrThrow();
  const session = await lucia.createSession(user.id, { second_factor: true, second_factor_failures: 0 });
  created.push(session.id);
  cookieJar.sessionId = session.id;
}

export async function signOutAll(): Promise<void> {
  for (const id of created.splice(0)) await lucia.invalidateSession(id);
  cookieJar.sessionId = null;
}

/** Posts a body (an object is sent as JSON; a string is sent as it is). */
export async function postEstimate(body: unknown): Promise<{ status: number; json: any; text: string }> {
  const req = new Request('http://127.0.0.1:3100/api/v1/plating/estimate', {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: typeof body === 'string' ? body : JSON.stringify(body),
  });
  const res = await POST(req, { params: Promise.resolve({}) });
  const text = await res.text();
  let json: unknown = null;
  try {
    json = JSON.parse(text);
  } catch {
    json = null;
  }
  return { status: res.status, json, text };
}
