import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';

/** Starts a local fake on the loopback interface (port 0: any free one) and says where it listens. */
export async function listenOnLoopback(server: Server, port = 0): Promise<{ port: number; url: string }> {
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const address = server.address() as AddressInfo;
  return { port: address.port, url: `http://127.0.0.1:${address.port}` };
}
