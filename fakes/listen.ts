// Port handling shared by the local fakes: a second Namesake on the same machine must not crash
// because the first one already holds the fake's usual port.
import type { AddressInfo } from 'node:net';

type Listener = {
  listen(port: number, host: string, cb: () => void): unknown;
  once(event: 'error', fn: (err: Error) => void): unknown;
  off(event: 'error', fn: (err: Error) => void): unknown;
};

/**
 * Listens on 127.0.0.1:`port`. With `orFreePort`, a port that is taken (EADDRINUSE) is not an
 * error: the server takes any free port instead, and the caller reads the real one from the result.
 */
export async function listenLocal(server: Listener, address: () => AddressInfo | string | null, port: number, orFreePort = false): Promise<number> {
  const attempt = (p: number) =>
    new Promise<void>((resolve, reject) => {
      server.once('error', reject);
      server.listen(p, '127.0.0.1', () => {
        server.off('error', reject);
        resolve();
      });
    });
  try {
    await attempt(port);
  } catch (err) {
    if (!orFreePort || port === 0 || (err as NodeJS.ErrnoException).code !== 'EADDRINUSE') throw err;
    await attempt(0); // a net.Server may listen again after a failed listen()
  }
  return (address() as AddressInfo).port;
}
