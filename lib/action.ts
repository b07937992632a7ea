import 'server-only';
import { unstable_rethrow } from 'next/navigation';
import type { z } from 'zod';
import { isDatabaseUnavailable } from '@/db/errors';
import { requirePermission, type SessionUser } from '@/lib/auth/current-user';
import type { Permission } from '@/lib/auth/roles';
import { AppError, DATABASE_UNAVAILABLE_MESSAGE } from '@/lib/errors';

import type { FormState } from '@/lib/action-state';

export type { FormState } from '@/lib/action-state';

const SECRET_FIELD = /password|confirm|current|token/i;

export function formValues(formData: FormData): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, v] of formData.entries()) {
    if (typeof v === 'string' && !k.startsWith('$ACTION') && !SECRET_FIELD.test(k)) out[k] = v;
  }
  return out;
}

export function zodFieldErrors(error: z.ZodError): Record<string, string[]> {
  // A Map, so a field named like an Object method (valueOf, constructor) is just a key;
  // fromEntries gives a plain object with own properties only.
  const out = new Map<string, string[]>();
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_form';
    out.set(key, [...(out.get(key) ?? []), issue.message]);
  }
  return Object.fromEntries(out);
}

export function errorToFormState(err: unknown, values?: Record<string, string>): FormState {
  unstable_rethrow(err); // redirect(), notFound() and friends pass through
  if (err instanceof AppError) return { ok: false, message: err.message, fieldErrors: err.fieldErrors, values };
  if (isDatabaseUnavailable(err)) return { ok: false, message: DATABASE_UNAVAILABLE_MESSAGE, values };
  console.error('[action] unexpected error:', err);
  return { ok: false, message: 'Something went wrong and nothing was saved. Please try again.', values };
}

type Handler<S extends z.ZodType, U> = (input: z.infer<S>, user: U, formData: FormData) => Promise<FormState | void>;

// A server action behind a form: asks who is signed in and whether they may, parses every field
// with zod (all field errors at once), then runs the business function. Nothing is written when
// any of this fails. redirect() must be called by the handler after its writes.
export function formAction<S extends z.ZodType>(permission: Permission, schema: S, handler: Handler<S, SessionUser>) {
  return async (_prev: FormState, formData: FormData): Promise<FormState> => {
    const values = formValues(formData);
    try {
      const user = await requirePermission(permission);
      const parsed = schema.safeParse(Object.fromEntries(formData.entries()));
      if (!parsed.success) return { ok: false, message: 'Check the highlighted fields.', fieldErrors: zodFieldErrors(parsed.error), values };
      return (await handler(parsed.data, user, formData)) ?? { ok: true };
    } catch (err) {
      return errorToFormState(err, values);
    }
  };
}

// The same for forms used while signed out (sign-in, password reset).
export function publicFormAction<S extends z.ZodType>(schema: S, handler: Handler<S, null>) {
  return async (_prev: FormState, formData: FormData): Promise<FormState> => {
    const values = formValues(formData);
    try {
      const parsed = schema.safeParse(Object.fromEntries(formData.entries()));
      if (!parsed.success) return { ok: false, message: 'Check the highlighted fields.', fieldErrors: zodFieldErrors(parsed.error), values };
      return (await handler(parsed.data, null, formData)) ?? { ok: true };
    } catch (err) {
      return errorToFormState(err, values);
    }
  };
}
