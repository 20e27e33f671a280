import type { Server } from 'node:http';
import type { Express } from 'express';

/** The server could not start for a reason its message states in one line. */
export class StartupError extends Error {}

/** Resolves once the server listens; rejects with a StartupError saying why it could not. */
export function listen(app: Express, port: number, host: string): Promise<Server> {
  return new Promise((resolve, reject) => {
    const server = app.listen(port, host);
    server.once('listening', () => resolve(server));
    server.once('error', (error: NodeJS.ErrnoException) => reject(new StartupError(listenProblem(error, port, host))));
  });
}

function listenProblem(error: NodeJS.ErrnoException, port: number, host: string): string {
  switch (error.code) {
    case 'EADDRINUSE':
      return `port ${port} on ${host} is already in use (by another program or another Tallyfit); set PORT to a free port`;
    case 'EACCES':
      return `this account may not listen on port ${port}; set PORT to a port above 1023`;
    case 'EADDRNOTAVAIL':
    case 'ENOTFOUND':
      return `${host} is not an address of this machine; set HOST to one of its addresses (or 0.0.0.0)`;
    default:
      return `could not listen on ${host}:${port} (${error.code ?? error.message})`;
  }
}
