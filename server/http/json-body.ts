import express, { type RequestHandler } from 'express';
import { UnsupportedMediaError, ValidationError } from './errors';

/** API requests carry small JSON documents; uploads (multipart) have their own limit. */
const JSON_LIMIT = '1mb';

/**
 * No API body comes near this; deeper ones are refused before anything recursive (zod builds its messages with
 * JSON.stringify) can run out of stack on them.
 */
export const JSON_DEPTH_LIMIT = 64;

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
  const refuseDeepNesting: RequestHandler = (req, _res, next) => {
    const tooDeep = nestingDepthExceeds(req.body, JSON_DEPTH_LIMIT);
    next(
      tooDeep
        ? new ValidationError(`The request body is nested more than ${JSON_DEPTH_LIMIT} levels deep.`, { code: 'json_too_deep' })
        : undefined,
    );
  };
  return [express.json({ limit: JSON_LIMIT }), refuseOtherTypes, refuseDeepNesting];
}

/** Walks with its own stack, so the check itself cannot overflow. */
function nestingDepthExceeds(value: unknown, limit: number): boolean {
  const pending: [unknown, number][] = [[value, 1]];
  for (let next = pending.pop(); next; next = pending.pop()) {
    const [node, depth] = next;
    if (typeof node !== 'object' || node === null) continue;
    if (depth > limit) return true;
    for (const child of Object.values(node)) pending.push([child, depth + 1]);
  }
  return false;
}
