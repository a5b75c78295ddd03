import type { INestApplication } from '@nestjs/common';
import type { ConfigType } from '@nestjs/config';
import { DocumentBuilder, SwaggerModule } from '@nestjs/swagger';
import type { NextFunction, Request, Response } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import passport from 'passport';
import { SESSION_COOKIE } from './auth/session';
import { SessionStoreService } from './auth/session-store.service';
import { ApiExceptionFilter } from './common/filters/api-exception.filter';
import { Csrf } from './common/middleware/csrf';
import { createValidationPipe } from './common/pipes/validation';
import { StorableInputGuard } from './common/guards/storable-input.guard';
import { appConfig } from './config/app.config';
import { UsersService } from './users/users.service';
import { webStatic } from './web/web-static';

const TWO_WEEKS_MS = 14 * 24 * 60 * 60 * 1000;

/**
 * Everything around the Nest modules: headers, sessions, CSRF, validation, errors, docs, web app.
 * Used by main.ts and by the API tests, so tests exercise exactly what runs.
 */
export function configureApp(app: INestApplication): INestApplication {
  const cfg = app.get<ConfigType<typeof appConfig>>(appConfig.KEY);
  const users = app.get(UsersService);

  app.setGlobalPrefix('api');
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: false,
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          // MUI/emotion inject <style> elements at run time.
          styleSrc: ["'self'", "'unsafe-inline'"],
          // Monaco's editor worker may be created from a blob: URL.
          workerSrc: ["'self'", 'blob:'],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'", 'data:'],
          connectSrc: ["'self'"],
          objectSrc: ["'none'"],
          baseUri: ["'self'"],
          formAction: ["'self'"],
          frameAncestors: ["'none'"],
        },
      },
      // Served over plain http on loopback: no HSTS, no upgrade of requests to https.
      strictTransportSecurity: false,
    }),
  );
  app.use(
    session({
      name: SESSION_COOKIE,
      secret: cfg.sessionSecret,
      store: app.get(SessionStoreService).store,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: { httpOnly: true, sameSite: 'lax', secure: false, path: '/', maxAge: TWO_WEEKS_MS },
    }),
  );
  app.use(passport.initialize());
  // Load the signed-in user fresh on each request, so role changes apply at once.
  app.use(async (req: Request, _res: Response, next: NextFunction) => {
    try {
      const id = req.session?.userId;
      if (id) {
        const user = await users.findById(id);
        if (user) req.user = user;
        else delete req.session.userId;
      }
      next();
    } catch (err) {
      next(err);
    }
  });
  app.use('/api', app.get(Csrf).middleware());
  app.useGlobalGuards(new StorableInputGuard());
  app.useGlobalPipes(createValidationPipe());
  app.useGlobalFilters(new ApiExceptionFilter());

  const docs = new DocumentBuilder()
    .setTitle('Cribra API')
    .setDescription('Session cookie `cribra.sid`; state-changing requests need the `x-csrf-token` header from GET /api/auth/csrf.')
    .setVersion('0.1.0')
    .build();
  SwaggerModule.setup('api/docs', app, () => SwaggerModule.createDocument(app, docs));

  if (cfg.webDist) app.use(...webStatic(cfg.webDist));
  return app;
}
