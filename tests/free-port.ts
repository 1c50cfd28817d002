import { createServer, type AddressInfo } from 'node:net';

/** A loopback port nobody listened on a moment ago, so that test and benchmark servers do not collide. */
export function freePort(): Promise<number> {
  return new Promise((resolvePort, reject) => {
    const probe = createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as AddressInfo;
      probe.close(() => resolvePort(port));
    });
  });
}
