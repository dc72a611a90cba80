import nodemailer from 'nodemailer';
import type { Env } from '../env.ts';

export type Mail = { to: string; subject: string; text: string; html: string };
export type Mailer = { send(mail: Mail): Promise<void>; close(): void };

/** nodemailer over SMTP: the local mail fake by default, a real server by env (README). */
export function createMailer(env: Pick<Env, 'SMTP_HOST' | 'SMTP_PORT' | 'SMTP_SECURE' | 'SMTP_USER' | 'SMTP_PASS' | 'MAIL_FROM'>): Mailer {
  const transport = nodemailer.createTransport({
    host: env.SMTP_HOST,
    port: env.SMTP_PORT,
    secure: env.SMTP_SECURE,
    ignoreTLS: !env.SMTP_SECURE && /^(127\.|localhost)/.test(env.SMTP_HOST),
    auth: env.SMTP_USER ? { user: env.SMTP_USER, pass: env.SMTP_PASS ?? '' } : undefined,
  });
  return {
    async send(mail) {
      await transport.sendMail({ from: env.MAIL_FROM, ...mail });
    },
    close: () => transport.close(),
  };
}

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

/** A plain branded HTML wrapper; every value put in is escaped by the caller through `esc`. */
export function mailLayout(title: string, bodyHtml: string): string {
  return `<!doctype html><html><body style="margin:0;background:#fbf7f0;font-family:Nunito,Arial,sans-serif;color:#1f2a44">
<div style="max-width:560px;margin:0 auto;padding:24px">
<p style="font-size:20px;font-weight:800;color:#2f7d6d;margin:0 0 16px">Namesake</p>
<h1 style="font-size:20px;margin:0 0 12px">${esc(title)}</h1>
${bodyHtml}
<p style="font-size:12px;color:#55607a;margin-top:32px">You get this e-mail because of your account at Namesake.</p>
</div></body></html>`;
}
export { esc as escapeHtml };
