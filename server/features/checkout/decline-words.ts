// Why a payment did not go through, in our words (the provider's codes: Stripe API docs,
// "Declines" and "Error codes"). Every message says that nothing was charged and the cart waits.
const KEEP = 'Nothing was charged, and your cart is just as you left it.';

export function declineInOurWords(err: { code?: string | null; decline_code?: string | null } | null | undefined): string | null {
  if (!err) return null;
  const reason = err.decline_code ?? err.code ?? '';
  switch (reason) {
    case 'insufficient_funds':
      return `Your bank declined the card: there was not enough money on it. ${KEEP} Try another card.`;
    case 'generic_decline':
    case 'card_declined':
    case 'do_not_honor':
      return `Your bank declined the card without giving a reason. ${KEEP} Try another card, or ask your bank.`;
    case 'expired_card':
      return `That card has expired. ${KEEP} Try another card.`;
    case 'incorrect_cvc':
      return `The security code did not match the card. ${KEEP} Check the three digits on the back and try again.`;
    case 'payment_intent_authentication_failure':
      return `The extra check with your bank was not completed. ${KEEP} Try again and confirm the payment when your bank asks.`;
    case 'test_mode_live_card':
      return `That looks like a real card; this payment page takes test cards only. ${KEEP}`;
    default:
      return `The payment did not go through. ${KEEP} Try again or use another card.`;
  }
}

export const CANCELLED_WORDS = `You left the payment page before paying. ${KEEP}`;
