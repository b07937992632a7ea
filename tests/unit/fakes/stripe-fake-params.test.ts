import { describe, expect, it } from 'vitest';
import { StripeFakeError, metadataParam, parseFormParams, reqInteger } from '@/docker-free-scripts/fakes/stripe-fake-params';

describe('parseFormParams', () => {
  it('builds nested objects and arrays from the SDK form encoding', () => {
    // The encoding the stripe 23.1.0 SDK sent for checkout.sessions.create, captured on a local socket.
    const body =
      'mode=payment&line_items[0][quantity]=1&line_items[0][price_data][currency]=usd' +
      '&line_items[0][price_data][unit_amount]=1234&line_items[0][price_data][product_data][name]=Zinc' +
      '&payment_intent_data[metadata][invoice_id]=i1&success_url=http%3A%2F%2Fx%2Fs%3Fid%3D%7BCHECKOUT_SESSION_ID%7D' +
      '&expand[0]=payment_intent';
    expect(parseFormParams(body)).toEqual({
      mode: 'payment',
      line_items: [{ quantity: '1', price_data: { currency: 'usd', unit_amount: '1234', product_data: { name: 'Zinc' } } }],
      payment_intent_data: { metadata: { invoice_id: 'i1' } },
      success_url: 'http://x/s?id={CHECKOUT_SESSION_ID}',
      expand: ['payment_intent'],
    });
  });

  it('appends for empty brackets and keeps non-sequential keys as an object', () => {
    expect(parseFormParams('expand[]=a&expand[]=b')).toEqual({ expand: ['a', 'b'] });
    expect(parseFormParams('metadata[0]=a&metadata[2]=b')).toEqual({ metadata: { '0': 'a', '2': 'b' } });
  });

  it('rejects prototype keys, clashing shapes and malformed names', () => {
    expect(() => parseFormParams('metadata[__proto__][x]=1')).toThrow(StripeFakeError);
    expect(() => parseFormParams('a=1&a[b]=2')).toThrow(/both as a value and as an object/);
    expect(() => parseFormParams('a[b]=1&a=2')).toThrow(/both as a value and as an object/);
    expect(() => parseFormParams('a[b=1')).toThrow(/Malformed parameter name/);
  });
});

describe('parameter getters', () => {
  it('accepts whole numbers only, naming the parameter', () => {
    expect(reqInteger({ amount: '500' }, 'amount')).toBe(500);
    for (const bad of ['5.5', 'abc', '', '1e3']) {
      try {
        reqInteger({ amount: bad }, 'amount');
        expect.unreachable(`"${bad}" should be refused`);
      } catch (err) {
        expect(err).toBeInstanceOf(StripeFakeError);
        expect((err as StripeFakeError).param).toBe('amount');
        expect((err as StripeFakeError).status).toBe(400);
      }
    }
    expect(() => reqInteger({ amount: '-1' }, 'amount', 'amount', 1)).toThrow(/at least 1/);
  });

  it('merges metadata, dropping keys set to an empty string', () => {
    expect(metadataParam({ metadata: { b: '2', a: '' } }, { a: '1', c: '3' })).toEqual({ b: '2', c: '3' });
    expect(metadataParam({ metadata: '' }, { a: '1' })).toEqual({});
    expect(metadataParam({}, { a: '1' })).toEqual({ a: '1' });
  });
});
