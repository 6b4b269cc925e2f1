import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { type TestApp, startTestApp } from '../fixtures/test-app';
import { createUser } from '../fixtures/test-accounts';

describe('HTTP surface', () => {
  let app: TestApp;
  beforeAll(async () => {
    app = await startTestApp();
  });
  afterAll(() => app.close());

  it('GET /api/health answers anonymously', async () => {
    await request(app.url).get('/api/health').expect(200, { status: 'ok' });
  });

  it('answers an unknown API route with 404 JSON', async () => {
    const response = await request(app.url).get('/api/no/such/route').expect(404).expect('content-type', /json/);
    expect(response.body.error.code).toBe('route_not_found');
  });

  it('answers malformed JSON with 400 and a message', async () => {
    const agent = await app.agent();
    const response = await agent.post('/api/auth/login').type('json').send('{"email": "a@b.test",').expect(400);
    expect(response.body.error).toMatchObject({ code: 'malformed_json', message: 'The request body is not valid JSON.' });
  });

  it('answers an oversized JSON body with 413', async () => {
    const agent = await app.agent();
    const response = await agent
      .post('/api/projects')
      .send({ name: 'x', code: 'X', description: 'x'.repeat(1_100_000) })
      .expect(413);
    expect(response.body.error.code).toBe('payload_too_large');
  });

  it('refuses bodies that are neither JSON nor multipart with 415', async () => {
    const agent = await app.agent();
    const response = await agent.post('/api/auth/login').type('form').send('email=a@b.test&password=x').expect(415);
    expect(response.body.error.code).toBe('unsupported_media_type');
  });

  it('never sends a stack trace or internal detail to the client', async () => {
    const agent = await app.agent();
    const responses = await Promise.all([
      agent.post('/api/auth/login').type('json').send('{'),
      agent.get('/api/projects/not-a-uuid'),
      request(app.url).get('/api/users'),
    ]);
    for (const response of responses) expect(JSON.stringify(response.body)).not.toMatch(/\bat .*\.(ts|js):\d+|node_modules|stack/);
  });

  it('sends security headers with a CSP the client can run under', async () => {
    const response = await request(app.url).get('/api/health').expect(200);
    const csp = response.headers['content-security-policy'];
    expect(csp).toContain("script-src 'self' 'wasm-unsafe-eval'");
    expect(csp).toContain("style-src 'self' 'unsafe-inline'");
    expect(csp).toContain("img-src 'self' data: blob:");
    expect(csp).toContain("worker-src 'self' blob:");
    expect(csp).not.toContain('upgrade-insecure-requests');
    expect(response.headers['x-content-type-options']).toBe('nosniff');
    expect(response.headers['x-powered-by']).toBeUndefined();
    expect(response.headers['strict-transport-security']).toBeUndefined();
  });

  it('sets httpOnly SameSite=Lax cookies', async () => {
    const user = await createUser(app.dataSource);
    const agent = await app.agent();
    const response = await agent.post('/api/auth/login').send({ email: user.email, password: 'correct-horse-42' }).expect(200);
    const cookies = ([] as string[]).concat(response.headers['set-cookie'] ?? []);
    const session = cookies.find((c) => c.startsWith('taulens.sid='));
    expect(session).toMatch(/HttpOnly/i);
    expect(session).toMatch(/SameSite=Lax/i);
    expect(session).not.toMatch(/Secure/i);
  });

  it('explains that the client is not built instead of a blank page', async () => {
    const response = await request(app.url).get('/projects/anything').expect(503);
    expect(response.text).toContain('npm run build');
  });
});

describe('HTTP surface behind TLS, with a built client', () => {
  let app: TestApp;
  let webRoot: string;
  beforeAll(async () => {
    webRoot = await mkdtemp(path.join(os.tmpdir(), 'taulens-web-'));
    await writeFile(path.join(webRoot, 'index.html'), '<!doctype html><title>Taulens</title><tl-root></tl-root>');
    await writeFile(path.join(webRoot, 'main-ABCD1234.js'), 'console.log(1)');
    app = await startTestApp({ publicUrl: 'https://taulens.example.org', trustProxy: true, webRoot });
  });
  afterAll(async () => {
    await app.close();
    await rm(webRoot, { recursive: true, force: true });
  });

  it('serves index.html for client routes and the files as they are', async () => {
    const page = await request(app.url).get('/projects/123/findings').expect(200).expect('content-type', /html/);
    expect(page.text).toContain('<tl-root>');
    const script = await request(app.url).get('/main-ABCD1234.js').expect(200);
    expect(script.headers['cache-control']).toContain('immutable');
    await request(app.url).get('/missing-file.js').expect(404);
  });

  it('marks cookies Secure and sends HSTS', async () => {
    const response = await request(app.url).get('/api/auth/csrf').set('X-Forwarded-Proto', 'https').expect(200);
    const cookies = ([] as string[]).concat(response.headers['set-cookie'] ?? []);
    expect(cookies.some((c) => c.startsWith('__Host-taulens.csrf=') && /Secure/i.test(c))).toBe(true);
    expect(response.headers['strict-transport-security']).toBeDefined();
    expect(response.headers['content-security-policy']).toContain('upgrade-insecure-requests');
  });
});
