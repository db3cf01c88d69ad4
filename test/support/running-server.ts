import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { TestDatabase } from './test-database.js';
import { appOver } from './test-app.js';

export interface RunningServer {
  baseUrl: string;
  close(): Promise<void>;
}

/** The real app on a free loopback port, over a test database. */
export async function startServer(db: TestDatabase): Promise<RunningServer> {
  const app = appOver(db);
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const { port } = server.address() as AddressInfo;
  return {
    baseUrl: `http://127.0.0.1:${port}`,
    close: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}
