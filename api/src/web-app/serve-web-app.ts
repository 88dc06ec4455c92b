import type { Logger } from '@nestjs/common';
import type { NestExpressApplication } from '@nestjs/platform-express';
import type { NextFunction, Request, Response } from 'express';
import { existsSync } from 'node:fs';
import type { ServerResponse } from 'node:http';
import { extname, join } from 'node:path';

const isApiPath = (path: string) => path === '/api' || path.startsWith('/api/');

/**
 * Serves the built web app (the React app of the `client/` workspace) from `dir` at / with a
 * single-page-app fallback: a GET for a path without a file extension outside /api gets index.html,
 * so the web app's routes survive a reload.
 * /api stays with Nest (its unknown routes are JSON 404s). Returns false, after logging a hint,
 * when there is no build.
 */
export function serveWebApp(app: NestExpressApplication, dir: string, logger: Logger): boolean {
  const indexFile = join(dir, 'index.html');
  if (!existsSync(indexFile)) {
    logger.warn(
      `No built web app at ${dir}; serving the API only. Build it with: npm run build -w @keyloom/client`,
    );
    return false;
  }
  app.useStaticAssets(dir, {
    index: false,
    redirect: false,
    // Vite puts content-hashed files in assets/, safe to cache for a long time.
    setHeaders: (res: ServerResponse, path: string) => {
      if (path.includes(`${join(dir, 'assets')}`))
        res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
    },
  });
  app.use((req: Request, res: Response, next: NextFunction) => {
    if ((req.method !== 'GET' && req.method !== 'HEAD') || isApiPath(req.path) || extname(req.path) !== '') {
      next();
      return;
    }
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(indexFile);
  });
  logger.log(`Serving the built web app from ${dir}`);
  return true;
}
