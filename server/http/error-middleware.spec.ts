import express from 'express';
import multer from 'multer';
import request from 'supertest';
import { apiNotFound, errorMiddleware, httpStatusOf } from './error-middleware';
import {
  ConflictError,
  DependencyFailedError,
  ForbiddenError,
  GoneError,
  NotFoundError,
  PayloadTooLargeError,
  RateLimitedError,
  UnauthenticatedError,
  UnprocessableError,
  UnsupportedMediaError,
  ValidationError,
} from './errors';

/** A bare app whose routes throw, so the middleware is tested without the rest of the server. */
function appThrowing(error: unknown) {
  const app = express();
  app.use(express.json({ limit: '1kb' }));
  app.post('/echo', (req, res) => {
    res.json(req.body);
  });
  app.get('/throw', () => {
    throw error;
  });
  app.post('/upload', multer({ limits: { fileSize: 10 } }).single('file'), (_req, res) => {
    res.json({});
  });
  app.use('/api', apiNotFound);
  app.use(errorMiddleware);
  return app;
}

describe('httpStatusOf', () => {
  it.each([
    [new ValidationError('v'), 400],
    [new UnauthenticatedError(), 401],
    [new ForbiddenError(), 403],
    [new NotFoundError(), 404],
    [new ConflictError('c'), 409],
    [new GoneError('g'), 410],
    [new PayloadTooLargeError(), 413],
    [new UnsupportedMediaError(), 415],
    [new UnprocessableError('u'), 422],
    [new RateLimitedError(), 429],
    [new DependencyFailedError('d'), 502],
  ])('maps %s to %i', (error, status) => {
    expect(httpStatusOf(error)).toBe(status);
  });
});

describe('errorMiddleware', () => {
  it.each([
    [new NotFoundError('Project not found.', { code: 'project_not_found' }), 404, 'project_not_found'],
    [new ConflictError('Code taken.', { code: 'project_code_taken', details: { code: 'A-1' } }), 409, 'project_code_taken'],
    [new GoneError('Expired.', { code: 'invitation_expired' }), 410, 'invitation_expired'],
    [new PayloadTooLargeError(), 413, 'payload_too_large'],
  ])('answers %s with its status and {error:{code,message,details}}', async (error, status, code) => {
    const response = await request(appThrowing(error)).get('/throw').expect(status);
    expect(response.body).toEqual({ error: { code, message: error.message, details: error.details ?? null } });
  });

  it('hides the cause of unknown errors and keeps the stack out of the answer', async () => {
    const response = await request(appThrowing(new Error('SQLITE_CORRUPT at /secret/path'))).get('/throw').expect(500);
    expect(response.body.error.code).toBe('internal');
    expect(JSON.stringify(response.body)).not.toMatch(/SQLITE|secret|at \//);
  });

  it('answers malformed JSON with 400 malformed_json', async () => {
    const response = await request(appThrowing(null)).post('/echo').type('json').send('{"name": ').expect(400);
    expect(response.body.error.code).toBe('malformed_json');
  });

  it('answers an oversized JSON body with 413', async () => {
    const response = await request(appThrowing(null))
      .post('/echo')
      .send({ text: 'x'.repeat(2000) })
      .expect(413);
    expect(response.body.error.code).toBe('payload_too_large');
  });

  it('answers an upload over the multer limit with 413', async () => {
    const response = await request(appThrowing(null))
      .post('/upload')
      .attach('file', Buffer.alloc(100), 'model.ifc')
      .expect(413);
    expect(response.body.error.code).toBe('payload_too_large');
  });

  it('answers unknown API routes with 404 JSON', async () => {
    const response = await request(appThrowing(null)).delete('/api/nothing/here?x=1').expect(404);
    expect(response.body.error).toEqual({
      code: 'route_not_found',
      message: 'There is no API route DELETE /api/nothing/here.',
      details: null,
    });
  });
});
