// Paying on the Stripe fake's hosted page (fakes/stripe) without a browser: the same form POST the
// page's own form makes, with an invented parcel address (like all demo data) and a test card.

/** The fake's test card that always pays (the provider's documented 4242 test card). */
export const TEST_CARD_OK = '4242 4242 4242 4242';

/** The parcel address typed on the payment page; `extra` adds the optional fields (ship_line2, ship_state). */
export function hostedPaymentForm(card = TEST_CARD_OK, extra: Record<string, string> = {}): Record<string, string> {
  return {
    ship_name: 'Dana Field',
    ship_line1: '12 Acorn Lane',
    ship_city: 'Harbourtown',
    ship_postal_code: 'HT1 2AB',
    ship_country: 'GB',
    ...extra,
    card_number: card,
    card_expiry: '12/34',
    card_cvc: '123',
  };
}

/** Posts the payment form to the hosted page at `url`; a paid page answers 303 (not followed). */
export function payOnHostedPage(url: string, card = TEST_CARD_OK, extra: Record<string, string> = {}): Promise<Response> {
  return fetch(url, { method: 'POST', body: new URLSearchParams(hostedPaymentForm(card, extra)), redirect: 'manual' });
}
