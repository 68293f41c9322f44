// Headers and a same-origin rule for everything that changes data.
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import helmet from 'helmet';
import type { Config } from '../config.js';
import { HttpError } from './http-error.js';

/** helmet's headers; the content policy keeps every fetch, image and font on our own host. */
export function securityHeaders(config: Config): RequestHandler {
  return helmet({
    contentSecurityPolicy:
      config.env === 'development'
        ? false
        : {
            useDefaults: true,
            directives: {
              'default-src': ["'self'"],
              'img-src': ["'self'", 'data:', 'blob:'],
              'connect-src': ["'self'"],
              'font-src': ["'self'", 'data:'],
              'style-src': ["'self'", "'unsafe-inline'"],
              'script-src': ["'self'"],
              'frame-src': ["'self'"],
              'object-src': ["'none'"],
              'upgrade-insecure-requests': config.publicUrl.startsWith('https://') ? [] : null,
            },
          },
    strictTransportSecurity: config.publicUrl.startsWith('https://'),
    crossOriginEmbedderPolicy: false,
  });
}

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * State-changing API requests must come from our own pages: the browser's Origin (or
 * Sec-Fetch-Site) says where a request was made. Requests without either header come from
 * scripts and tools, not from another site's page, and are let through to the usual checks.
 */
export function sameOriginWrites(config: Config): RequestHandler {
  const own = new URL(config.publicUrl).origin;
  return (req: Request, _res: Response, next: NextFunction) => {
    if (SAFE.has(req.method)) return next();
    const site = req.get('sec-fetch-site');
    if (site && site !== 'same-origin' && site !== 'none') {
      throw new HttpError(403, 'cross_site', 'Changes must be made from Heelwood\'s own pages.');
    }
    const origin = req.get('origin');
    if (origin && origin !== own) {
      const host = req.get('host');
      const sameHost = host && (origin === `http://${host}` || origin === `https://${host}`);
      if (!sameHost) throw new HttpError(403, 'cross_site', 'Changes must be made from Heelwood\'s own pages.');
    }
    next();
  };
}
