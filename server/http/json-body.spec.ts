import express from 'express';
import request from 'supertest';
import { z } from 'zod';
import { errorMiddleware } from './error-middleware';
import { JSON_DEPTH_LIMIT, jsonBody } from './json-body';
import { validate } from './validate';

function app() {
  const a = express();
  a.use(jsonBody());
  a.post('/things', validate({ body: z.object({ name: z.string(), settings: z.record(z.string(), z.unknown()).default({}) }) }), (_req, res) => {
    res.json({ ok: true });
  });
  a.use(errorMiddleware);
  return a;
}

const nestedArrays = (depth: number) => '['.repeat(depth) + ']'.repeat(depth);
const nestedObjects = (depth: number) => '{"a":'.repeat(depth) + '1' + '}'.repeat(depth);

describe('jsonBody', () => {
  it('passes ordinary bodies and bodies nested to the limit', async () => {
    await request(app()).post('/things').send({ name: 'Bay 3', settings: { a: { b: [1, [2]] } } }).expect(200);
    const atLimit = `{"name":"x","settings":${nestedObjects(JSON_DEPTH_LIMIT - 1)}}`;
    await request(app()).post('/things').type('json').send(atLimit).expect(200);
  });

  // Found by probing: 10,000 nested arrays overflowed the stack while zod built its message, and the answer was a 500.
  it.each([
    ['arrays as the body', nestedArrays(10_000)],
    ['arrays in a field', `{"name":${nestedArrays(100_000)}}`],
    ['objects in a free-form field', `{"name":"x","settings":${nestedObjects(50_000)}}`],
    ['one level over the limit', `{"name":"x","settings":${nestedObjects(JSON_DEPTH_LIMIT)}}`],
  ])('answers deeply nested %s with a plain 400', async (_title, body) => {
    const response = await request(app()).post('/things').type('json').send(body).expect(400);
    expect(response.body.error).toEqual({
      code: 'json_too_deep',
      message: `The request body is nested more than ${JSON_DEPTH_LIMIT} levels deep.`,
      details: null,
    });
  });
});
