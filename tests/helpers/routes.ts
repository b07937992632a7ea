// Discovers every page, route handler and server action from the code and the build, with the
// permission each one asks for, so the access matrix covers new routes without being told.
import { readFileSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';

export const ROOT = path.resolve(__dirname, '../..');
const APP = path.join(ROOT, 'app');

/** `anyOf`: the permissions any one of which lets a caller in (a page or action asks for one). */
export type Guard = { kind: 'permission'; permission: string; anyOf: string[] } | { kind: 'public' } | { kind: 'unguarded' };

function permissionGuard(anyOf: string[]): Guard {
  return { kind: 'permission', permission: anyOf[0]!, anyOf };
}

/** Whether a role gets past a guard (roleCan over any of its permissions). */
export function guardAllows(guard: Guard, allows: (permission: string) => boolean): boolean {
  return guard.kind === 'permission' && guard.anyOf.some(allows);
}
export type PageRoute = { file: string; pattern: string; guard: Guard };
export type ApiRoute = { file: string; pattern: string; method: string; guard: Guard };
export type ActionRoute = { id: string; file: string; name: string; pagePattern: string; guard: Guard };

function walk(dir: string, out: string[] = []): string[] {
  for (const name of readdirSync(dir)) {
    const p = path.join(dir, name);
    if (statSync(p).isDirectory()) walk(p, out);
    else out.push(p);
  }
  return out;
}

// app/(shop)/quotes/[quoteId]/page.tsx → /quotes/[quoteId]
export function urlPattern(appRelativeDir: string): string {
  const segments = appRelativeDir.split(/[\\/]/).filter((s) => s && s !== '.' && !/^\(.*\)$/.test(s) && !s.startsWith('@'));
  return `/${segments.join('/')}`;
}

const PERMISSION_CALL = /requirePageUser\(\s*'([a-z.]+)'/;

export function discoverPages(): PageRoute[] {
  return walk(APP)
    .filter((f) => /[\\/]page\.tsx$/.test(f))
    .map((file) => {
      const src = readFileSync(file, 'utf8');
      const m = src.match(PERMISSION_CALL);
      return { file: path.relative(ROOT, file), pattern: urlPattern(path.relative(APP, path.dirname(file))), guard: m ? permissionGuard([m[1]!]) : { kind: 'unguarded' } };
    });
}

export function discoverApiRoutes(): ApiRoute[] {
  const out: ApiRoute[] = [];
  for (const file of walk(APP).filter((f) => /[\\/]route\.ts$/.test(f))) {
    const src = readFileSync(file, 'utf8');
    const pattern = urlPattern(path.relative(APP, path.dirname(file)));
    for (const m of src.matchAll(/export\s+(?:const|async function|function)\s+(GET|POST|PUT|PATCH|DELETE)\b/g)) {
      const method = m[1]!;
      // withPermission('p', …) or apiRoute('p' | ['p', 'q'], …)
      const wrapped = src.match(new RegExp(`export\\s+const\\s+${method}\\s*=\\s*(?:withPermission|apiRoute)(?:<[^>]*>)?\\(\\s*(?:'([a-z.]+)'|\\[([^\\]]*)\\])`));
      const anyOf = wrapped ? (wrapped[1] ? [wrapped[1]] : [...wrapped[2]!.matchAll(/'([a-z.]+)'/g)].map((x) => x[1]!)) : [];
      out.push({ file: path.relative(ROOT, file), pattern, method, guard: anyOf.length ? permissionGuard(anyOf) : { kind: 'unguarded' } });
    }
  }
  return out;
}

type ManifestEntry = { filename: string; exportedName: string; workers: Record<string, unknown> };

export function discoverActions(distDir: string): ActionRoute[] {
  const manifest = JSON.parse(readFileSync(path.join(ROOT, distDir, 'server/server-reference-manifest.json'), 'utf8')) as {
    node: Record<string, ManifestEntry>;
  };
  return Object.entries(manifest.node).map(([id, e]) => {
    const src = readFileSync(path.join(ROOT, e.filename), 'utf8');
    const guarded = src.match(new RegExp(`export\\s+const\\s+${e.exportedName}\\s*=\\s*formAction\\(\\s*'([a-z.]+)'`));
    const isPublic = new RegExp(`export\\s+const\\s+${e.exportedName}\\s*=\\s*publicFormAction\\(`).test(src);
    const worker = Object.keys(e.workers).find((w) => w.startsWith('app/')) ?? '';
    return {
      id,
      file: e.filename,
      name: e.exportedName,
      pagePattern: urlPattern(worker.replace(/^app\//, '').replace(/\/(page|route)$/, '')),
      guard: guarded ? permissionGuard([guarded[1]!]) : isPublic ? { kind: 'public' } : { kind: 'unguarded' },
    };
  });
}

// A concrete URL for a pattern: ids that exist nowhere, so a permitted caller gets 404, not data.
export function sampleUrl(pattern: string): string {
  return pattern.replace(/\[\[?\.{0,3}([A-Za-z]+)\]?\]/g, (_m, name: string) =>
    /id$/i.test(name) ? '00000000-0000-4000-8000-000000000000' : 'SAMPLE-0',
  );
}
