// The fake's parser for Stripe-style form bodies with bracket keys (fakes/stripe/http.ts).
import { describe, expect, it } from 'vitest';
import { parseForm } from '../../../fakes/stripe/http.ts';

describe('form parser', () => {
  it('when a Stripe-style body has bracket keys, then it nests hashes and indexed arrays', () => {
    const p = parseForm('line_items[0][price_data][unit_amount]=1999&line_items[1][quantity]=2&expand[]=a&expand[]=b&metadata[0]=x&name=Mila+Ann%20B%26co');
    expect(p).toEqual({
      line_items: [{ price_data: { unit_amount: '1999' } }, { quantity: '2' }],
      expand: ['a', 'b'],
      metadata: { '0': 'x' },
      name: 'Mila Ann B&co',
    });
  });

  it('when a key tries to reach the prototype, then no prototype is polluted', () => {
    const p = parseForm('__proto__[polluted]=yes&a[__proto__][x]=1');
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    expect(Object.getPrototypeOf(p)).toBe(Object.prototype);
  });

  it('when a key is both a value and a hash, then it is refused', () => {
    expect(() => parseForm('a=1&a[b]=2')).toThrow(/hash/);
  });
});
