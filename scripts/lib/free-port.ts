import { createServer } from 'node:net';

/** Asks the kernel for an unused loopback TCP port (bind to port 0, read it back, release it). */
export function findFreePort(host = '127.0.0.1'): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.unref();
    server.on('error', reject);
    server.listen(0, host, () => {
      const address = server.address();
      if (address === null || typeof address === 'string') {
        server.close();
        reject(new Error('could not read the port of a probe socket'));
        return;
      }
      const { port } = address;
      server.close(() => resolve(port));
    });
  });
}
