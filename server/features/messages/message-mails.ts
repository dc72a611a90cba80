// The e-mail that tells the other party a message is waiting, with a link to the thread. The text a
// person typed is escaped (nothing typed may run script, in an e-mail client either).
import { escapeHtml as esc, type Mail, mailLayout } from '../../integrations/mailer.ts';

/** Longest excerpt of the message put in the e-mail; the whole text is on the order page. */
const EXCERPT_CHARS = 600;

export function messageMail(to: { email: string; name: string }, m: { fromName: string; orderNumber: string; body: string; hasPhoto: boolean; link: string }): Mail {
  const excerpt = m.body.length > EXCERPT_CHARS ? `${m.body.slice(0, EXCERPT_CHARS)}…` : m.body;
  const photo = m.hasPhoto ? 'A photo is attached; open the thread to see it.' : '';
  return {
    to: to.email,
    subject: `New message about order ${m.orderNumber}`,
    text: [`Hello ${to.name},`, '', `${m.fromName} wrote about order ${m.orderNumber}:`, '', excerpt, ...(photo ? ['', photo] : []), '', `Read and answer: ${m.link}`].join('\n'),
    html: mailLayout(
      `New message about order ${m.orderNumber}`,
      `<p>Hello ${esc(to.name)},</p><p>${esc(m.fromName)} wrote about order ${esc(m.orderNumber)}:</p>
<p style="white-space:pre-wrap;border-left:3px solid #e4dccd;padding-left:12px">${esc(excerpt)}</p>
${photo ? `<p>${esc(photo)}</p>` : ''}
<p><a href="${esc(m.link)}" style="display:inline-block;background:#e0a526;color:#1f2a44;font-weight:800;padding:10px 18px;border-radius:8px;text-decoration:none">Read and answer</a></p>`,
    ),
  };
}
