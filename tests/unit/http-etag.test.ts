// Conditional answers (lib/http-etag.ts): validators compared as RFC 9110 §13.1.2 says; an answer
// whose validator is known first is made only when the reader does not already hold it.
import { describe, expect, it } from 'vitest';
import { conditionalByValidator, etagFor, matches } from '@/lib/http-etag';

describe('matches', () => {
  it('finds the validator in a list, in its strong form, or as "*"', () => {
    const etag = etagFor('{"rows":[]}');
    expect(matches(etag, etag)).toBe(true);
    expect(matches(`"other", ${etag.slice(2)}`, etag)).toBe(true);
    expect(matches('*', etag)).toBe(true);
    expect(matches('"other"', etag)).toBe(false);
    expect(matches(null, etag)).toBe(false);
  });
});

describe('conditionalByValidator', () => {
  const etag = 'W/"lsomething"';
  it('sends the JSON with its validator to a reader without it', async () => {
    const res = await conditionalByValidator(new Request('http://x/'), etag, async () => '{"a":1}');
    expect(res.status).toBe(200);
    expect(res.headers.get('etag')).toBe(etag);
    expect(res.headers.get('content-type')).toBe('application/json');
    expect(res.headers.get('cache-control')).toBe('private, no-cache');
    expect(await res.text()).toBe('{"a":1}');
  });
  it('answers 304 without making the answer to a reader holding the validator', async () => {
    let made = 0;
    const res = await conditionalByValidator(new Request('http://x/', { headers: { 'if-none-match': etag } }), etag, async () => (made++, '{}'));
    expect(res.status).toBe(304);
    expect(await res.text()).toBe('');
    expect(made).toBe(0);
  });
});
