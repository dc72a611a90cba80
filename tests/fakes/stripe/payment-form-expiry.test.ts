// The payment page's expiry field as people type it: with or without the slash, two- or four-digit years.
import { describe, expect, it } from 'vitest';
import { checkCard } from '../../../fakes/stripe/payment-form.ts';

const today = new Date(Date.UTC(2026, 11, 2));
const card = (card_expiry: string) => checkCard({ card_number: '4242 4242 4242 4242', card_expiry, card_cvc: '123' }, today);

describe('checkCard: the expiry date', () => {
  it.each([
    ['12/30', 12, 2030],
    ['1230', 12, 2030],
    ['12 / 30', 12, 2030],
    ['122030', 12, 2030],
    ['1/31', 1, 2031],
  ])('when typed as "%s", then it is month %i of %i', (typed, month, year) => {
    const c = card(typed);
    expect(c.errors.card_expiry).toBeUndefined();
    expect(c.card).toMatchObject({ exp_month: month, exp_year: year });
  });

  it.each(['1330', '12/3', '12345', 'next year'])('when typed as "%s", then it asks for MM/YY', (typed) => {
    expect(card(typed).errors.card_expiry).toMatch(/MM\/YY/);
  });

  it('when the month has passed, then it says the card expired', () => {
    expect(card('1126').errors.card_expiry).toMatch(/expired/);
  });
});
