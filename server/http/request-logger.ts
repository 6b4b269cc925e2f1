import { randomUUID } from 'node:crypto';
import type { IncomingMessage, ServerResponse } from 'node:http';
import type { RequestHandler } from 'express';
import type { Logger } from 'pino';
import { pinoHttp } from 'pino-http';

/** Token links must not end up in logs, where anyone reading them could use them. */
function withoutTokens(url: string | undefined): string {
  return (url ?? '').replace(/(\/(?:invitations|password-reset)\/)[^/?]+/, '$1[token]');
}

/**
 * One log line per request with a request id (also sent as X-Request-Id and quoted in 500
 * answers). Only method, URL and status are logged: no cookies, headers or bodies.
 */
export function requestLogger(logger: Logger): RequestHandler {
  return pinoHttp({
    logger,
    genReqId: (_req: IncomingMessage, res: ServerResponse) => {
      const id = randomUUID();
      res.setHeader('X-Request-Id', id);
      return id;
    },
    customLogLevel: (req, res, error) => {
      if (error || res.statusCode >= 500) return 'error';
      // 4xx answers are normal traffic (every anonymous page load gets a 401 from /api/auth/me);
      // static files served fine only matter when debugging.
      return req.url?.startsWith('/api/') || res.statusCode >= 400 ? 'info' : 'debug';
    },
    autoLogging: { ignore: (req) => req.url === '/api/health' },
    serializers: {
      req: (req: IncomingMessage & { id?: unknown }) => ({ id: req.id, method: req.method, url: withoutTokens(req.url) }),
      res: (res: ServerResponse) => ({ statusCode: res.statusCode }),
    },
  });
}
