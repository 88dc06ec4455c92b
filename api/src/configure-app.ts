import { BadRequestException, Logger } from '@nestjs/common';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { DocumentBuilder, SwaggerModule } from '@nestjs/swagger';
import connectPgSimple from 'connect-pg-simple';
import type { NextFunction, Request, Response } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import passport from 'passport';
import type { Pool } from 'pg';
import { NO_SESSION_MESSAGE, SESSION_COOKIE } from './auth/session-user';
import { serveWebApp } from './web-app/serve-web-app';
import { INVALID_JSON_MESSAGE } from './common/filters/api-exception.filter';
import { AppConfig } from './config/app-config';
import { SessionPool } from './database/session-pool';

/**
 * Everything Express-level that main.ts and the HTTP tests share: security headers, the built
 * client, sessions in PostgreSQL, passport, the /api prefix and the OpenAPI pages.
 * Call before app.init()/listen(). Returns the session store's pg Pool (closed by app.close()).
 */
export function configureApp(app: NestExpressApplication): Pool {
  const config = app.get(AppConfig);
  const logger = new Logger('Keyloom');

  // trust proxy: off by default, so req.ip is the socket address (the API listens on loopback and
  // nobody can spoof X-Forwarded-For). In production Keyloom is meant to sit behind a TLS proxy on the
  // same machine: trusting the loopback hop gives the real client address (sign-in limits, audit log)
  // and lets express-session see HTTPS (X-Forwarded-Proto) for its Secure cookie.
  app.set('trust proxy', config.isProduction ? 'loopback' : false);
  app.disable('x-powered-by');

  app.use(
    helmet({
      // HSTS only where Keyloom is served over HTTPS.
      strictTransportSecurity: config.isProduction,
      contentSecurityPolicy: {
        useDefaults: false,
        directives: {
          defaultSrc: ["'self'"],
          // No inline or remote scripts; the Vite build and Swagger UI load theirs from files.
          scriptSrc: ["'self'"],
          scriptSrcAttr: ["'none'"],
          // Inline styles: Swagger UI's page has a <style> block; libraries set style attributes.
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:'],
          fontSrc: ["'self'"],
          connectSrc: ["'self'"],
          objectSrc: ["'none'"],
          baseUri: ["'self'"],
          formAction: ["'self'"],
          frameAncestors: ["'none'"],
          // Only behind HTTPS; on plain http://127.0.0.1 it would break nothing, but on a LAN address it would.
          upgradeInsecureRequests: config.isProduction ? [] : null,
        },
      },
    }),
  );

  serveWebApp(app, config.webAppDist, logger);

  const pool = app.get(SessionPool).pool;
  const PgStore = connectPgSimple(session);
  app.use(
    '/api',
    session({
      name: SESSION_COOKIE,
      secret: config.sessionSecret,
      store: new PgStore({ pool, tableName: 'session', createTableIfMissing: false }),
      resave: false,
      saveUninitialized: false,
      unset: 'destroy',
      cookie: {
        httpOnly: true,
        sameSite: 'lax',
        secure: config.isProduction,
        path: '/',
        maxAge: config.sessionMaxAgeMs,
      },
    }),
  );
  app.use('/api', passport.initialize());
  app.use('/api', passport.session());

  // No API answer is kept by the browser's or a proxy's cache (they carry clients' data): every
  // response says no-store unless its route sets its own Cache-Control (the model downloads, with an
  // ETag). OWASP Session Management Cheat Sheet, "Web Content Caching".
  app.use('/api', (_req: Request, res: Response, next: NextFunction) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });

  // In production the API description is for signed-in staff only.
  if (config.isProduction) {
    app.use(['/api/docs', '/api/docs-json'], (req: Request, res: Response, next: NextFunction) => {
      if (req.isAuthenticated() && req.user) return next();
      res.status(401).json({ statusCode: 401, message: NO_SESSION_MESSAGE, error: 'Unauthorized' });
    });
  }

  // JSON bodies up to 2 MB (bigger: 413): the largest is a long test-keyboard trial's log (20,000
  // logged steps); file uploads use multipart with their own limits.
  // Parsed here rather than by Nest so a malformed body can be told apart from other 400s
  // (Nest would turn it into a BadRequestException carrying the parser's own message).
  app.useBodyParser('json', { limit: '2mb' });
  app.use('/api', (error: unknown, _req: Request, _res: Response, next: NextFunction) => {
    const type = (error as { type?: unknown } | null)?.type;
    next(type === 'entity.parse.failed' ? new BadRequestException(INVALID_JSON_MESSAGE) : error);
  });

  app.setGlobalPrefix('api');

  const document = SwaggerModule.createDocument(
    app,
    new DocumentBuilder()
      .setTitle('Keyloom API')
      .setDescription(
        'Session cookie auth (keyloom.sid). State-changing requests need the X-CSRF-Token header ' +
          'from GET /api/auth/csrf.',
      )
      .setVersion('0.1.0')
      .addCookieAuth(SESSION_COOKIE)
      .build(),
  );
  SwaggerModule.setup('api/docs', app, document, { jsonDocumentUrl: 'api/docs-json' });

  return pool;
}
