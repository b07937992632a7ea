import 'server-only';
import type { z } from 'zod';
import { getCurrentUser, type SessionUser } from '@/lib/auth/current-user';
import { type Permission, roleCan } from '@/lib/auth/roles';
import { AppError } from '@/lib/errors';
import { errorResponse } from '@/lib/http';
import { authenticateToken, RateLimited, rateHeaders, type RateState } from './tokens';

type Ctx<P> = { params: Promise<P> };

/**
 * A /api/v1 route: the caller is an API token (Authorization: Bearer) or, without that header, the
 * browser's session. Either way the same permission decides, and the handler gets the same kind
 * of user, so the browser's scoping rules hold for tokens. Token answers carry their rate headers.
 */
export function apiRoute<P = Record<string, string>>(
  permission: Permission | readonly Permission[],
  handler: (req: Request, user: SessionUser, ctx: Ctx<P>) => Promise<Response>,
) {
  return async (req: Request, ctx: Ctx<P>): Promise<Response> => {
    let rate: RateState | null = null;
    try {
      const authorization = req.headers.get('authorization');
      let user: SessionUser;
      if (authorization !== null) {
        const r = await authenticateToken(authorization);
        rate = r.rate;
        user = r.user;
        if (!mayAny(user, permission)) throw new AppError('FORBIDDEN', 'This token’s role may not do this.');
      } else {
        const signedIn = await getCurrentUser();
        if (!signedIn) throw new AppError('UNAUTHENTICATED', 'Sign in, or send an API token as "Authorization: Bearer …".');
        if (!mayAny(signedIn, permission)) throw new AppError('FORBIDDEN', 'You are not allowed to do this.');
        user = signedIn;
      }
      const res = await handler(req, user, ctx);
      if (rate) for (const [k, v] of Object.entries(rateHeaders(rate))) res.headers.set(k, v);
      return res;
    } catch (err) {
      const res = errorResponse(err);
      if (err instanceof RateLimited) {
        rate = err.rate;
        res.headers.set('retry-after', String(err.rate.resetSeconds));
      }
      if (rate) for (const [k, v] of Object.entries(rateHeaders(rate))) res.headers.set(k, v);
      return res;
    }
  };
}

function mayAny(user: SessionUser, permission: Permission | readonly Permission[]): boolean {
  return (typeof permission === 'string' ? [permission] : permission).some((p) => roleCan(user.role, p));
}

/** The query string, parsed by the endpoint's schema (a bad value is a 400 naming the field). */
export function parseQuery<T extends z.ZodType>(req: Request, schema: T): z.infer<T> {
  return schema.parse(Object.fromEntries(new URL(req.url).searchParams)) as z.infer<T>;
}

/** The answer, parsed by its documented schema first, so the document and the answer agree. */
export function apiJson<T extends z.ZodType>(schema: T, data: z.input<T>, status = 200): Response {
  return Response.json(schema.parse(data), { status, headers: { 'cache-control': 'private, no-store' } });
}
