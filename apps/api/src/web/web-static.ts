import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import express, { NextFunction, Request, RequestHandler, Response } from 'express';

/**
 * Serves the built web app from `dir` and answers every other non-/api GET with index.html
 * (the router in the browser takes it from there).
 */
export function webStatic(dir: string): RequestHandler[] {
  const root = resolve(dir);
  const index = join(root, 'index.html');
  const files = express.static(root, { index: false, maxAge: '1h' });
  const isApi = (req: Request) => req.path === '/api' || req.path.startsWith('/api/');
  return [
    (req: Request, res: Response, next: NextFunction) => (isApi(req) ? next() : files(req, res, next)),
    (req: Request, res: Response, next: NextFunction) => {
      if ((req.method !== 'GET' && req.method !== 'HEAD') || isApi(req)) return next();
      if (!existsSync(index)) {
        res.status(503).type('text').send('The web app is not built yet (run `npm start`, or `npx vite build`).');
        return;
      }
      res.setHeader('Cache-Control', 'no-cache');
      res.sendFile(index);
    },
  ];
}
