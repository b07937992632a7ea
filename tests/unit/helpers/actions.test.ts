// The test helper that reads a server action's answer: it must find the object, braces inside
// strings included, or the hostile-input run would silently see no field names.
import { describe, expect, it } from 'vitest';
import { actionRequest, objectInAnswer } from '../../helpers/actions';

describe('objectInAnswer', () => {
  const answer = '0:{"a":"$@1"}\n1:{"ok":false,"fieldErrors":{"code":["Use } and { freely \\" here"],"name":["x"]},"values":{"code":"{"}}\n';
  it('parses the object after the key, braces in strings included', () => {
    expect(objectInAnswer(answer, 'fieldErrors')).toEqual({ code: ['Use } and { freely " here'], name: ['x'] });
    expect(objectInAnswer(answer, 'values')).toEqual({ code: '{' });
  });
  it('answers null when the key is absent', () => {
    expect(objectInAnswer(answer, 'missing')).toBeNull();
  });
});

describe('actionRequest', () => {
  it('puts the fields under _1_ and the argument list last', () => {
    const init = actionRequest('abc', { name: 'Kestrel' }, 'http://127.0.0.1:1');
    const form = init.body as FormData;
    expect([...form.keys()]).toEqual(['_1_name', '0']);
    expect(new Headers(init.headers).get('next-action')).toBe('abc');
  });
});
