import type { Server } from 'node:http';
import type { AddressInfo, Server as NetServer } from 'node:net';

/** The only interface the stand-ins bind to: they must never be reachable from another host. */
export const LOOPBACK_HOST = '127.0.0.1';

/**
 * Starts a server listening on 127.0.0.1 and reports the port it really got.
 *
 * @param server - a node:net or node:http server that is not listening yet.
 * @param port - TCP port, 0 for an ephemeral one chosen by the OS.
 * @returns the bound port number.
 * @throws the listen error (EADDRINUSE, EACCES…) as a rejected promise.
 * @example await listenOnLoopback(http.createServer(app), 0) // e.g. 41873
 */
export function listenOnLoopback(server: NetServer, port: number): Promise<number> {
  return new Promise((resolve, reject) => {
    const onError = (error: Error): void => reject(error);
    server.once('error', onError);
    server.listen(port, LOOPBACK_HOST, () => {
      server.off('error', onError);
      resolve((server.address() as AddressInfo).port);
    });
  });
}

/**
 * Stops an HTTP server: no new connections, idle keep-alive sockets closed at once (SDK agents
 * keep them open), open requests given until they finish.
 *
 * @param server - a listening node:http server; one that is not listening resolves at once.
 * @returns a promise that settles when the server has closed.
 * @example await closeHttpServer(server)
 */
export function closeHttpServer(server: Server): Promise<void> {
  return new Promise((resolve) => {
    if (!server.listening) {
      resolve();
      return;
    }
    server.close(() => resolve());
    server.closeIdleConnections();
  });
}
