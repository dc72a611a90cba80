// E-mails from the workroom to the shopper: a change request on a proof, and the shipped notice.
// HTML and plain text; every value a person typed is escaped (a product rule: nothing typed may run
// script anywhere, an e-mail client included).
import { trackingUrl } from '../../../shared/tracking.ts';
import { escapeHtml as esc, type Mail, mailLayout } from '../../integrations/mailer.ts';

const button = (href: string, label: string) =>
  `<p><a href="${esc(href)}" style="display:inline-block;background:#e0a526;color:#1f2a44;font-weight:800;padding:10px 18px;border-radius:8px;text-decoration:none">${esc(label)}</a></p>`;

export function changeRequestMail(
  to: { email: string; name: string },
  r: { shopName: string; orderNumber: string; orderId: string; lineTitle: string; text: string; message: string },
  baseUrl: string,
): Mail {
  const link = `${baseUrl}/orders/${encodeURIComponent(r.orderId)}`;
  return {
    to: to.email,
    subject: `${r.shopName} asks you to check your personalisation (order ${r.orderNumber})`,
    text: [
      `Hello ${to.name},`,
      '',
      `${r.shopName} checked the proof of “${r.lineTitle}” (${r.text || 'your design'}) before cutting and asks for a change:`,
      '',
      `  ${r.message}`,
      '',
      'Nothing is cut until you have had another look. Edit the personalisation on your order page:',
      link,
    ].join('\n'),
    html: mailLayout(
      `Please check your personalisation`,
      `<p>Hello ${esc(to.name)},</p><p>${esc(r.shopName)} checked the proof of “${esc(r.lineTitle)}” (${esc(r.text || 'your design')}) before cutting and asks for a change:</p>
<blockquote style="margin:0 0 12px;padding:10px 14px;border-left:4px solid #2f7d6d;background:#fff">${esc(r.message)}</blockquote>
<p>Nothing is cut until you have had another look.</p>
${button(link, 'Edit your personalisation')}`,
    ),
  };
}

export function shippedMail(
  to: { email: string; name: string },
  r: { shopName: string; orderNumber: string; orderId: string; carrier: string; trackingNumber: string; items: string[] },
  baseUrl: string,
): Mail {
  const link = `${baseUrl}/orders/${encodeURIComponent(r.orderId)}`;
  const track = trackingUrl(r.carrier, r.trackingNumber);
  return {
    to: to.email,
    subject: `Your order ${r.orderNumber} from ${r.shopName} has shipped`,
    text: [
      `Hello ${to.name},`,
      '',
      `${r.shopName} has sent your order ${r.orderNumber}.`,
      `Carrier: ${r.carrier}`,
      `Tracking number: ${r.trackingNumber}`,
      ...(track ? [`Follow the parcel: ${track}`] : []),
      '',
      'In the parcel:',
      ...r.items.map((i) => `  ${i}`),
      '',
      'Care: wait 24 h before the first wash; wash inside out, cool; no bleach; never iron directly on the design.',
      '',
      `Your order: ${link}`,
    ].join('\n'),
    html: mailLayout(
      `Order ${r.orderNumber} has shipped`,
      `<p>Hello ${esc(to.name)},</p><p>${esc(r.shopName)} has sent your order ${esc(r.orderNumber)}.</p>
<p>Carrier: <strong>${esc(r.carrier)}</strong><br>Tracking number: ${track ? `<a href="${esc(track)}">` : ''}<strong style="font-family:monospace">${esc(r.trackingNumber)}</strong>${track ? '</a>' : ''}</p>
<ul>${r.items.map((i) => `<li>${esc(i)}</li>`).join('')}</ul>
<p style="font-size:14px;color:#4a5470">Care: wait 24 h before the first wash; wash inside out, cool; no bleach; never iron directly on the design.</p>
${button(link, 'See your order')}`,
    ),
  };
}

/** The proof is approved: the shop has checked the personalisation and starts making it. */
export function inProductionMail(to: { email: string; name: string }, r: { shopName: string; orderNumber: string; orderId: string; items: string[] }, baseUrl: string): Mail {
  const link = `${baseUrl}/orders/${encodeURIComponent(r.orderId)}`;
  return {
    to: to.email,
    subject: `In production: ${r.shopName} approved your personalisation (order ${r.orderNumber})`,
    text: [
      `Hello ${to.name},`,
      '',
      `${r.shopName} has checked your personalisation letter by letter and is making it now:`,
      ...r.items.map((i) => `  ${i}`),
      '',
      'Nothing more is needed from you. We will e-mail you again when it ships.',
      '',
      `Your order: ${link}`,
    ].join('\n'),
    html: mailLayout(
      `In production`,
      `<p>Hello ${esc(to.name)},</p><p>${esc(r.shopName)} has checked your personalisation letter by letter and is making it now:</p>
<ul>${r.items.map((i) => `<li>${esc(i)}</li>`).join('')}</ul>
<p>Nothing more is needed from you. We will e-mail you again when it ships.</p>
${button(link, 'See your order')}`,
    ),
  };
}
