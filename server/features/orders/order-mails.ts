// The e-mails about orders: confirmation to the shopper, a new-order notice to each shop, refunds.
// HTML and plain text; every value a person typed is escaped (a product rule: nothing typed may run
// script anywhere, an e-mail client included).

import { formatMoney } from '../../../shared/money.ts';
import type { LineSnapshot } from '../../../shared/schemas/cart.ts';
import { escapeHtml as esc, type Mail, mailLayout } from '../../integrations/mailer.ts';

export type MailLine = { title: string; quantity: number; totalMinor: number; snapshot: LineSnapshot };
export type MailOrder = { number: string; shopName: string; currency: string; subtotalMinor: number; shippingMinor: number; totalMinor: number; lines: MailLine[] };

const personalisationText = (s: LineSnapshot) => s.summary.map((x) => `${x.label}: ${x.value}`).join('; ');
const personalisationHtml = (s: LineSnapshot) => s.summary.map((x) => `<span style="white-space:nowrap">${esc(x.label)}: <strong>${esc(x.value)}</strong></span>`).join(' · ');

function orderBlockHtml(o: MailOrder): string {
  const rows = o.lines
    .map(
      (l) => `<tr><td style="padding:6px 0;vertical-align:top">${l.quantity} × ${esc(l.title)}<br><span style="font-size:13px;color:#4a5470">${personalisationHtml(l.snapshot)}</span></td>
<td style="padding:6px 0;text-align:right;vertical-align:top;white-space:nowrap">${esc(formatMoney(l.totalMinor, o.currency))}</td></tr>`,
    )
    .join('\n');
  return `<div style="border:1px solid #e4dccd;border-radius:8px;background:#fff;padding:12px 16px;margin:0 0 12px">
<p style="margin:0 0 6px;font-weight:800">${esc(o.shopName)} · order ${esc(o.number)}</p>
<table style="width:100%;border-collapse:collapse;font-size:15px">${rows}
<tr><td style="padding:6px 0;color:#4a5470">Shipping</td><td style="text-align:right">${esc(formatMoney(o.shippingMinor, o.currency))}</td></tr>
<tr><td style="padding:6px 0;font-weight:800">Shop total</td><td style="text-align:right;font-weight:800">${esc(formatMoney(o.totalMinor, o.currency))}</td></tr>
</table></div>`;
}

function orderBlockText(o: MailOrder): string {
  const lines = o.lines.map((l) => `  ${l.quantity} x ${l.title} — ${formatMoney(l.totalMinor, o.currency)}\n    ${personalisationText(l.snapshot)}`);
  return [`${o.shopName} · order ${o.number}`, ...lines, `  Shipping: ${formatMoney(o.shippingMinor, o.currency)}`, `  Shop total: ${formatMoney(o.totalMinor, o.currency)}`].join('\n');
}

export function confirmationMail(to: { email: string; name: string }, orders: MailOrder[], baseUrl: string): Mail {
  const currency = orders[0]?.currency ?? 'USD';
  const total = orders.reduce((a, o) => a + o.totalMinor, 0);
  const numbers = orders.map((o) => o.number).join(', ');
  const link = `${baseUrl}/orders`;
  const intro = orders.length > 1 ? `Your payment covers ${orders.length} shops, so you have ${orders.length} orders, one from each shop.` : 'Your payment went through and the shop has your order.';
  return {
    to: to.email,
    subject: `Thank you! Your Namesake order ${numbers}`,
    text: [
      `Hello ${to.name},`,
      '',
      intro,
      'Each shop checks the spelling of your personalisation before it cuts anything; we will e-mail you when it is approved and made, if the shop needs you to check something, and when it ships.',
      '',
      ...orders.map(orderBlockText).flatMap((b) => [b, '']),
      `Paid in total: ${formatMoney(total, currency)}`,
      '',
      `Follow your orders: ${link}`,
    ].join('\n'),
    html: mailLayout(
      'Thank you for your order',
      `<p>Hello ${esc(to.name)},</p><p>${esc(intro)} Each shop checks the spelling of your personalisation before it cuts anything; we will e-mail you when it is approved and made, if the shop needs you to check something, and when it ships.</p>
${orders.map(orderBlockHtml).join('\n')}
<p style="font-size:17px;font-weight:800">Paid in total: ${esc(formatMoney(total, currency))}</p>
<p><a href="${esc(link)}" style="display:inline-block;background:#e0a526;color:#1f2a44;font-weight:800;padding:10px 18px;border-radius:8px;text-decoration:none">Follow your orders</a></p>`,
    ),
  };
}

export function newOrderMail(to: { email: string; name: string }, o: MailOrder & { feeMinor: number; buyerName: string }, baseUrl: string): Mail {
  const link = `${baseUrl}/workroom`;
  const payout = formatMoney(o.totalMinor - o.feeMinor, o.currency);
  const fee = formatMoney(o.feeMinor, o.currency);
  return {
    to: to.email,
    subject: `New order ${o.number} for ${o.shopName}`,
    text: [
      `Hello ${to.name},`,
      '',
      `${o.buyerName} ordered from ${o.shopName}. Check the spelling of each personalisation in the workroom before cutting.`,
      '',
      orderBlockText(o),
      '',
      `Your payout: ${payout} (order total less the Namesake fee of ${fee}).`,
      `Open the workroom: ${link}`,
    ].join('\n'),
    html: mailLayout(
      `New order ${o.number}`,
      `<p>Hello ${esc(to.name)},</p><p>${esc(o.buyerName)} ordered from ${esc(o.shopName)}. Check the spelling of each personalisation in the workroom before cutting.</p>
${orderBlockHtml(o)}
<p>Your payout: <strong>${esc(payout)}</strong> (order total less the Namesake fee of ${esc(fee)}).</p>
<p><a href="${esc(link)}" style="display:inline-block;background:#e0a526;color:#1f2a44;font-weight:800;padding:10px 18px;border-radius:8px;text-decoration:none">Open the workroom</a></p>`,
    ),
  };
}

export function refundMail(
  to: { email: string; name: string },
  r: { number: string; shopName: string; currency: string; amountMinor: number; what: string; reason: string | null; orderId: string },
  baseUrl: string,
): Mail {
  const amount = formatMoney(r.amountMinor, r.currency);
  const link = `${baseUrl}/orders/${encodeURIComponent(r.orderId)}`;
  return {
    to: to.email,
    subject: `Refund of ${amount} for order ${r.number}`,
    text: [
      `Hello ${to.name},`,
      '',
      `${r.shopName} refunded ${amount} for ${r.what} (order ${r.number}). It goes back to the card you paid with; banks usually take 5–10 days to show it.`,
      ...(r.reason ? ['', `Reason: ${r.reason}`] : []),
      '',
      `Your order: ${link}`,
    ].join('\n'),
    html: mailLayout(
      `Refund for order ${r.number}`,
      `<p>Hello ${esc(to.name)},</p><p>${esc(r.shopName)} refunded <strong>${esc(amount)}</strong> for ${esc(r.what)} (order ${esc(r.number)}). It goes back to the card you paid with; banks usually take 5–10 days to show it.</p>
${r.reason ? `<p>Reason: ${esc(r.reason)}</p>` : ''}
<p><a href="${esc(link)}">See your order</a></p>`,
    ),
  };
}
