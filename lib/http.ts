import 'server-only';
import { NextResponse } from 'next/server';
import { z } from 'zod';
import { isDatabaseUnavailable } from '@/db/errors';
import { requirePermission, type SessionUser } from '@/lib/auth/current-user';
import type { Permission } from '@/lib/auth/roles';
import { AppError, DATABASE_UNAVAILABLE_MESSAGE } from '@/lib/errors';
import { zodFieldErrors } from '@/lib/action';

export type ApiError = { error: { code: string; message: string; fields?: Record<string, string[]> } };

export function jsonError(status: number, code: string, message: string, fields?: Record<string, string[]>) {
  return NextResponse.json<ApiError>({ error: { code, message, ...(fields ? { fields } : {}) } }, { status });
}

export function errorResponse(err: unknown): NextResponse {
  if (err instanceof AppError) return jsonError(err.status, err.code, err.message, err.fieldErrors);
  if (err instanceof z.ZodError) return jsonError(400, 'BAD_INPUT', 'Some values are missing or not valid.', zodFieldErrors(err));
  if (isDatabaseUnavailable(err)) return jsonError(503, 'UNAVAILABLE', DATABASE_UNAVAILABLE_MESSAGE);
  console.error('[api] unexpected error:', err);
  return jsonError(500, 'INTERNAL', 'Something went wrong. Nothing was saved.');
}

type Ctx<P> = { params: Promise<P> };

// A route handler that asks who is signed in and whether they may, then maps every failure to
// `{ error: { code, message } }` with the right status.
export function withPermission<P = Record<string, string>>(
  permission: Permission,
  handler: (req: Request, user: SessionUser, ctx: Ctx<P>) => Promise<Response>,
) {
  return async (req: Request, ctx: Ctx<P>): Promise<Response> => {
    try {
      const user = await requirePermission(permission);
      return await handler(req, user, ctx);
    } catch (err) {
      return errorResponse(err);
    }
  };
}

const MAX_JSON_BYTES = 1_000_000;

export async function readJson(req: Request): Promise<unknown> {
  const length = Number(req.headers.get('content-length') ?? 0);
  if (length > MAX_JSON_BYTES) throw new AppError('TOO_LARGE', 'The request body is too large.');
  const text = await req.text();
  if (text.length > MAX_JSON_BYTES) throw new AppError('TOO_LARGE', 'The request body is too large.');
  try {
    return JSON.parse(text);
  } catch {
    throw new AppError('BAD_INPUT', 'The request body is not valid JSON.');
  }
}
