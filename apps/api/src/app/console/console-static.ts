import express, { type Express } from 'express';
import { join } from 'node:path';
import { API_PREFIX } from '../http/route-table';

/** Serves the built console and answers its client-side routes with index.html. */
export function serveConsole(app: Express, consoleDir: string): void {
  app.use(express.static(consoleDir, { index: false, maxAge: '1h' }));
  app.get('/{*splat}', (req, res, next) => {
    if (req.path.startsWith(API_PREFIX) || req.path.startsWith('/api/')) return next();
    res.sendFile(join(consoleDir, 'index.html'), { headers: { 'Cache-Control': 'no-cache' } });
  });
}
