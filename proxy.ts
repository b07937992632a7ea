import { type NextRequest, NextResponse } from 'next/server';
import { contentSecurityPolicy } from '@/lib/security/csp';

// Cross-site request check for route handlers: a state-changing request must come from our own
// origin. Server actions get the same check from Next itself. The Stripe webhook is exempt: it is
// authenticated by its signature instead. This is not the permission check (lib/auth does that).
export function proxy(req: NextRequest) {
  if (!req.nextUrl.pathname.startsWith('/api/')) {
    const nonce = Buffer.from(crypto.randomUUID()).toString('base64');
    const csp = contentSecurityPolicy(nonce, {
      dev: process.env.NODE_ENV === 'development',
      https: (process.env.APP_URL ?? '').startsWith('https://'),
    });
    const headers = new Headers(req.headers);
    // Layouts read the requested path to send a signed-out visitor back to it after sign-in.
    headers.set('x-ampwright-path', req.nextUrl.pathname + req.nextUrl.search);
    headers.set('x-nonce', nonce);
    headers.set('Content-Security-Policy', csp);
    const res = NextResponse.next({ request: { headers } });
    res.headers.set('Content-Security-Policy', csp);
    return res;
  }
  if (req.method === 'GET' || req.method === 'HEAD' || req.method === 'OPTIONS') return NextResponse.next();
  if (req.nextUrl.pathname.startsWith('/api/webhooks/')) return NextResponse.next();
  const origin = req.headers.get('origin');
  const host = req.headers.get('x-forwarded-host') ?? req.headers.get('host');
  if (origin !== null) {
    let originHost: string | null = null;
    try {
      originHost = new URL(origin).host;
    } catch {
      originHost = null;
    }
    if (!host || originHost !== host) {
      return NextResponse.json({ error: { code: 'FORBIDDEN', message: 'Cross-site request refused.' } }, { status: 403 });
    }
  }
  return NextResponse.next();
}

// Every page gets its nonce. An API request enters only with an Origin header: without one the check
// above lets it through anyway, so reads such as the grids' same-origin GETs (browsers send no Origin
// on those) are spared a proxy pass; sessions and permissions are checked in lib/auth either way.
export const config = {
  matcher: ['/((?!api/|_next/static|_next/image|favicon.ico).*)', { source: '/api/:path*', has: [{ type: 'header', key: 'origin' }] }],
};
