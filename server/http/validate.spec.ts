import express from 'express';
import request from 'supertest';
import { z } from 'zod';
import { errorMiddleware } from './error-middleware';
import { inputOf, validate } from './validate';

const schemas = {
  params: z.object({ id: z.uuid() }),
  query: z.object({ limit: z.coerce.number().int().max(100).default(20) }),
  body: z.object({ name: z.string().trim().min(1), role: z.enum(['engineer', 'reviewer']) }),
};

function app() {
  const a = express();
  a.use(express.json());
  a.post('/things/:id', validate(schemas), (_req, res) => {
    res.json(inputOf(res, schemas));
  });
  a.use(errorMiddleware);
  return a;
}

const ID = '1b9d6bcd-bbfd-4b2d-9b5d-ab8dfbbd4bed';

describe('validate', () => {
  it('puts the parsed params, query and body in res.locals.input', async () => {
    const response = await request(app()).post(`/things/${ID}?limit=5`).send({ name: '  Esme ', role: 'engineer', extra: 1 }).expect(200);
    expect(response.body).toEqual({ params: { id: ID }, query: { limit: 5 }, body: { name: 'Esme', role: 'engineer' } });
  });

  it('reports every issue of every part in one 400', async () => {
    const response = await request(app()).post('/things/not-a-uuid?limit=500').send({ role: 'boss' }).expect(400);
    expect(response.body.error.code).toBe('validation_failed');
    expect(response.body.error.details).toEqual([
      { location: 'params', field: 'id', message: expect.any(String) },
      { location: 'query', field: 'limit', message: expect.any(String) },
      { location: 'body', field: 'name', message: 'is required' },
      { location: 'body', field: 'role', message: expect.any(String) },
    ]);
    expect(response.body.error.message).toMatch(/^Please correct the request: id: .*; limit: .*; name: is required; role: /);
  });

  it('says a JSON body is required when there is none', async () => {
    const response = await request(app()).post(`/things/${ID}`).expect(400);
    expect(response.body.error.details).toEqual([{ location: 'body', field: '', message: 'a JSON body is required' }]);
  });
});
