// Request parameters for the Stripe fake: the SDK's form encoding turned into nested objects,
// typed getters that reject bad input, and the error type that becomes Stripe's error JSON.

export type Params = { [key: string]: ParamValue };
export type ParamValue = string | Params | ParamValue[];

export type StripeErrorType = 'invalid_request_error' | 'card_error' | 'api_error';

/** Carries the HTTP status and Stripe's `{ error: { type, message, param, code } }` body. */
export class StripeFakeError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly param?: string,
    readonly type: StripeErrorType = 'invalid_request_error',
    readonly code?: string,
  ) {
    super(message);
    this.name = 'StripeFakeError';
  }

  toBody() {
    return {
      error: {
        type: this.type,
        message: this.message,
        ...(this.param ? { param: this.param } : {}),
        ...(this.code ? { code: this.code } : {}),
      },
    };
  }
}

export const missing = (what: string, id: string, param = 'id', status = 404) =>
  new StripeFakeError(status, `No such ${what}: '${id}'`, param, 'invalid_request_error', 'resource_missing');

const FORBIDDEN_KEYS = new Set(['__proto__', 'constructor', 'prototype']);

/** `a[b][0][c]=1` → ['a', 'b', '0', 'c']; `a[]` → ['a', ''] (append). */
function splitKey(key: string): string[] {
  const first = key.indexOf('[');
  if (first === -1) return [key];
  const segments = [key.slice(0, first)];
  const rest = key.slice(first);
  const re = /\[([^\]]*)\]/g;
  let consumed = 0;
  for (let m = re.exec(rest); m; m = re.exec(rest)) {
    if (m.index !== consumed) break;
    segments.push(m[1] ?? '');
    consumed = m.index + m[0].length;
  }
  if (consumed !== rest.length) throw new StripeFakeError(400, `Malformed parameter name: ${key}`, key);
  return segments;
}

type Tree = { [key: string]: Tree | string };

function toArrays(node: Tree | string): ParamValue {
  if (typeof node === 'string') return node;
  const keys = Object.keys(node);
  const converted: Params = {};
  for (const k of keys) converted[k] = toArrays(node[k] as Tree | string);
  const isList = keys.length > 0 && keys.every((k, i) => k === String(i));
  return isList ? keys.map((k) => converted[k] as ParamValue) : converted;
}

/** Parses an `application/x-www-form-urlencoded` body or query string the way Stripe reads it. */
export function parseFormParams(encoded: string): Params {
  const root: Tree = {};
  for (const [key, value] of new URLSearchParams(encoded)) {
    const segments = splitKey(key);
    let node: Tree = root;
    segments.forEach((raw, i) => {
      if (FORBIDDEN_KEYS.has(raw)) throw new StripeFakeError(400, `Invalid parameter name: ${key}`, key);
      const segment = raw === '' ? String(Object.keys(node).length) : raw;
      const isLast = i === segments.length - 1;
      const existing = node[segment];
      if (isLast) {
        if (existing !== undefined && typeof existing !== 'string') {
          throw new StripeFakeError(400, `Parameter ${key} is given both as a value and as an object`, key);
        }
        node[segment] = value;
        return;
      }
      if (typeof existing === 'string') {
        throw new StripeFakeError(400, `Parameter ${key} is given both as a value and as an object`, key);
      }
      const child: Tree = existing ?? {};
      node[segment] = child;
      node = child;
    });
  }
  return toArrays(root) as Params;
}

export function optString(p: Params, key: string, param = key): string | undefined {
  const v = p[key];
  if (v === undefined) return undefined;
  if (typeof v !== 'string') throw new StripeFakeError(400, `Invalid string: ${param}`, param);
  return v;
}

export function reqString(p: Params, key: string, param = key): string {
  const v = optString(p, key, param);
  if (v === undefined || v === '') throw new StripeFakeError(400, `Missing required param: ${param}.`, param);
  return v;
}

export function optInteger(p: Params, key: string, param = key, min = 0): number | undefined {
  const v = optString(p, key, param);
  if (v === undefined) return undefined;
  if (!/^-?\d+$/.test(v) || !Number.isSafeInteger(Number(v))) {
    throw new StripeFakeError(400, `Invalid integer: ${v}`, param);
  }
  const n = Number(v);
  if (n < min) throw new StripeFakeError(400, `${param} must be at least ${min}.`, param);
  return n;
}

export function reqInteger(p: Params, key: string, param = key, min = 0): number {
  const n = optInteger(p, key, param, min);
  if (n === undefined) throw new StripeFakeError(400, `Missing required param: ${param}.`, param);
  return n;
}

export function optObject(p: Params, key: string, param = key): Params | undefined {
  const v = p[key];
  // The SDK sends `metadata=` to mean "empty object".
  if (v === undefined || v === '') return v === '' ? {} : undefined;
  if (typeof v !== 'object' || Array.isArray(v)) throw new StripeFakeError(400, `Invalid object: ${param}`, param);
  return v;
}

export function optList(p: Params, key: string, param = key): ParamValue[] | undefined {
  const v = p[key];
  if (v === undefined) return undefined;
  if (!Array.isArray(v)) throw new StripeFakeError(400, `Invalid array: ${param}`, param);
  return v;
}

export function currencyParam(p: Params, key: string, param = key): string {
  const v = reqString(p, key, param).toLowerCase();
  if (!/^[a-z]{3}$/.test(v)) throw new StripeFakeError(400, `Invalid currency: ${v}`, param);
  return v;
}

/** Stripe metadata: string values only; an empty value removes the key when updating. */
export function metadataParam(p: Params, previous: Record<string, string> = {}): Record<string, string> {
  const given = optObject(p, 'metadata');
  if (given === undefined) return { ...previous };
  if (Object.keys(given).length === 0) return {};
  const out: Record<string, string> = { ...previous };
  for (const [k, v] of Object.entries(given)) {
    if (typeof v !== 'string') throw new StripeFakeError(400, `Invalid metadata value for ${k}`, `metadata[${k}]`);
    if (v === '') delete out[k];
    else out[k] = v;
  }
  return out;
}

export function expandList(p: Params): string[] {
  const list = optList(p, 'expand') ?? [];
  return list.filter((v): v is string => typeof v === 'string');
}

export function limitParam(p: Params): number {
  const n = optInteger(p, 'limit', 'limit', 1) ?? 10;
  if (n > 100) throw new StripeFakeError(400, 'limit must be at most 100.', 'limit');
  return n;
}
