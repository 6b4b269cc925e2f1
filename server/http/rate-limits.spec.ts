import express, { type Request } from 'express';
import request from 'supertest';
import { errorMiddleware } from './error-middleware';
import { RATE_LIMITS, signInRateLimits } from './rate-limits';

// Real counts and windows; the slow-down steps are shortened so the test does not wait seconds.
const LIMITS = {
  ...RATE_LIMITS,
  signInSlowdownPerClient: { ...RATE_LIMITS.signInSlowdownPerClient, stepMs: 2, maxDelayMs: 10 },
};
const CLIENT = LIMITS.signInSlowdownPerClient;

/** A bare sign-in route: 'right password' signs in, anything else fails; it reports the delay the limiter applied. */
function app() {
  const a = express();
  a.set('trust proxy', 'loopback');
  a.use(express.json());
  a.post('/login', ...signInRateLimits(LIMITS), (req, res) => {
    const delay = (req as Request & { slowDown?: { delay: number } }).slowDown?.delay ?? 0;
    res.status(req.body.password === 'right password' ? 200 : 401).json({ delay });
  });
  a.use(errorMiddleware);
  return a;
}

function signIn(server: ReturnType<typeof app>, email: string, password: string, ip = '203.0.113.7') {
  return request(server).post('/login').set('X-Forwarded-For', ip).send({ email, password });
}

describe('signInRateLimits', () => {
  it('lets a colleague behind the same address sign in after one person failed many times with many addresses', async () => {
    const server = app();
    for (let i = 0; i < 60; i++) await signIn(server, `guess${i}@example.test`, 'wrong password').expect(401);
    await signIn(server, 'colleague@example.test', 'right password').expect(200);
  });

  it(`slows failures from one address down step by step after ${CLIENT.delayAfter}, up to a ceiling`, async () => {
    const server = app();
    const delays: number[] = [];
    for (let i = 0; i < CLIENT.delayAfter + 8; i++) {
      delays.push((await signIn(server, `guess${i}@example.test`, 'wrong password').expect(401)).body.delay);
    }
    const expected = delays.map((_, i) => Math.min(Math.max(0, i + 1 - CLIENT.delayAfter) * CLIENT.stepMs, CLIENT.maxDelayMs));
    expect(delays).toEqual(expected);
    expect(delays.at(-1)).toBe(CLIENT.maxDelayMs);
    // Another address is not slowed by them.
    expect((await signIn(server, 'guess0@example.test', 'wrong password', '198.51.100.4').expect(401)).body.delay).toBe(0);
  });

  it(`answers 429 after ${RATE_LIMITS.signInFailuresPerAccount.limit} failures for one account, even with the right password, and only for that account`, async () => {
    const server = app();
    for (let i = 0; i < RATE_LIMITS.signInFailuresPerAccount.limit; i++) {
      await signIn(server, 'target@example.test', 'wrong password').expect(401);
    }
    const blocked = await signIn(server, 'target@example.test', 'right password').expect(429);
    expect(blocked.body.error.code).toBe('rate_limited');
    await signIn(server, 'colleague@example.test', 'right password').expect(200);
  });
});
