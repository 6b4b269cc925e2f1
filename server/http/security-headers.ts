import { createHash } from 'node:crypto';
import type { RequestHandler } from 'express';
import helmet from 'helmet';

// Angular's production build loads its stylesheet with media="print" onload="this.media='all'"
// (critical-CSS inlining). Allowing exactly that handler by hash keeps every other inline script out.
const ANGULAR_STYLESHEET_ONLOAD = `'sha256-${createHash('sha256').update("this.media='all'").digest('base64')}'`;

/**
 * helmet with a CSP for the Angular app: own scripts only plus WebAssembly compilation (web-ifc),
 * inline styles (Angular Material sets style attributes), blob:/data: images, workers from self
 * or blob:. HSTS and upgrade-insecure-requests only when users reach us over https.
 */
export function securityHeaders(options: { tls: boolean }): RequestHandler {
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        defaultSrc: ["'self'"],
        baseUri: ["'self'"],
        scriptSrc: ["'self'", "'wasm-unsafe-eval'"],
        scriptSrcAttr: ["'unsafe-hashes'", ANGULAR_STYLESHEET_ONLOAD],
        styleSrc: ["'self'", "'unsafe-inline'"],
        imgSrc: ["'self'", 'data:', 'blob:'],
        fontSrc: ["'self'", 'data:'],
        connectSrc: ["'self'", 'blob:', 'data:'],
        workerSrc: ["'self'", 'blob:'],
        objectSrc: ["'none'"],
        frameAncestors: ["'none'"],
        formAction: ["'self'"],
        ...(options.tls ? { upgradeInsecureRequests: [] } : {}),
      },
    },
    strictTransportSecurity: options.tls,
  });
}
