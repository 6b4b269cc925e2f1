import express, { type RequestHandler } from 'express';
import { UnsupportedMediaError } from './errors';

/** API requests carry small JSON documents; uploads (multipart) have their own limit. */
const JSON_LIMIT = '1mb';

/**
 * Parses JSON bodies and refuses other body types, except multipart uploads which the upload
 * routes parse themselves. A request without a body passes.
 */
export function jsonBody(): RequestHandler[] {
  const refuseOtherTypes: RequestHandler = (req, _res, next) => {
    // type-is counts "Content-Length: 0" as a body; an empty POST (sign-out, archive) is fine.
    const empty = req.headers['content-length'] === '0';
    const refused = !empty && req.is(['application/json', 'multipart/form-data']) === false;
    next(refused ? new UnsupportedMediaError() : undefined);
  };
  return [express.json({ limit: JSON_LIMIT }), refuseOtherTypes];
}
