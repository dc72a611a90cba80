// A real SMTP listener on 127.0.0.1 that stores every message it receives as an .eml file.
// The app sends through it in development and tests; e2e tests and the admin mail page read the store.

import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { SMTPServer } from 'smtp-server';
import { listenLocal } from '../listen.ts';

export type MailFake = { port: number; dir: string; close(): Promise<void> };

const MAX_MESSAGE_BYTES = 5 * 1024 * 1024;

/** `port` 0 or omitted: a free port; `orFreePort`: a free port when `port` is taken. */
export async function startMailFake(opts: { port?: number; dir: string; orFreePort?: boolean }): Promise<MailFake> {
  fs.mkdirSync(opts.dir, { recursive: true });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    size: MAX_MESSAGE_BYTES,
    logger: false,
    onAuth(_auth, _session, cb) {
      cb(null, { user: 'local' });
    },
    onData(stream, _session, cb) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        if ((stream as unknown as { sizeExceeded?: boolean }).sizeExceeded) {
          cb(Object.assign(new Error('Message too large'), { responseCode: 552 }));
          return;
        }
        // time first so names sort by arrival; random part so two in one ms don't collide
        const name = `${Date.now().toString().padStart(14, '0')}-${crypto.randomBytes(4).toString('hex')}.eml`;
        const tmp = path.join(opts.dir, `.${name}.tmp`);
        fs.writeFileSync(tmp, Buffer.concat(chunks));
        fs.renameSync(tmp, path.join(opts.dir, name));
        cb();
      });
    },
  });
  const port = await listenLocal(server, () => server.server.address(), opts.port ?? 0, opts.orFreePort);
  return {
    port,
    dir: opts.dir,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
