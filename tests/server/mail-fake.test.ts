import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type MailFake, startMailFake } from '../../fakes/mail/server.ts';
import { listMail, readMail } from '../../fakes/mail/store.ts';
import { createMailer } from '../../server/integrations/mailer.ts';
import { at } from '../support/at.ts';

let fake: MailFake;
let dir: string;
beforeAll(async () => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'namesake-mail-'));
  fake = await startMailFake({ port: 0, dir });
});
afterAll(async () => {
  await fake.close();
  fs.rmSync(dir, { recursive: true, force: true });
});

describe('mail fake', () => {
  it('when nodemailer sends over SMTP, then the message is stored with its HTML and text', async () => {
    const mailer = createMailer({ SMTP_HOST: '127.0.0.1', SMTP_PORT: fake.port, SMTP_SECURE: false, MAIL_FROM: 'Namesake <hello@namesake.test>' });
    await mailer.send({ to: 'mira@namesake.test', subject: 'Hello Mira', text: 'plain body', html: '<p>html body</p>' });
    mailer.close();
    const m = at(await listMail(dir, { to: 'mira@' }), 0);
    expect(m.subject).toBe('Hello Mira');
    expect(m.text.trim()).toBe('plain body');
    expect(m.html).toContain('<p>html body</p>');
    expect(m.from).toContain('hello@namesake.test');
  });

  it('when an id tries to leave the folder, then nothing is read', async () => {
    expect(await readMail(dir, '../../etc/passwd')).toBeNull();
  });
});
