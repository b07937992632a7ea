// The session cookie the tests hand to route handlers through a stand-in for next/headers.
// No imports, so the vi.mock factory can load it before anything else.
export const cookieJar = { sessionId: null as string | null };

export function nextHeadersStandIn() {
  return {
    // Only the session cookie is ever read, so any name gets the session id.
    cookies: async () => ({
      get: (name: string) => (cookieJar.sessionId ? { name, value: cookieJar.sessionId } : undefined),
      set: () => undefined,
    }),
    headers: async () => new Headers(),
  };
}
