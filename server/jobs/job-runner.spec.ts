import path from 'node:path';
import { ValidationError } from '../http/errors';
import type { JobProgress } from './job-progress';
import { type JobRunner, createJobRunner, workerFile } from './job-runner';

const COUNT_UP = path.resolve(__dirname, '../../test/fixtures/jobs/count-up.job.ts');

describe('job runner', () => {
  let jobs: JobRunner;
  beforeAll(() => {
    jobs = createJobRunner({ maxThreads: 1 });
  });
  afterAll(() => jobs.close());

  it('runs a worker file in a thread and delivers every progress report before the result', async () => {
    const progress: JobProgress[] = [];
    const sum = await jobs.run<{ n: number }, number>(COUNT_UP, { n: 4 }, { onProgress: (p) => progress.push(p) });
    expect(sum).toBe(10);
    expect(progress).toEqual([1, 2, 3, 4].map((i) => ({ fraction: i / 4, message: `step ${i}` })));
  });

  it('brings a domain error back as the same class, code and details', async () => {
    const failure = jobs.run(COUNT_UP, { n: 0, fail: 'domain' });
    await expect(failure).rejects.toBeInstanceOf(ValidationError);
    await expect(failure).rejects.toMatchObject({ code: 'bad_n', message: 'n must be positive', details: [{ location: 'body', field: 'n', message: 'must be positive' }] });
  });

  it('rejects with the worker error for anything else', async () => {
    await expect(jobs.run(COUNT_UP, { n: 1, fail: 'crash' })).rejects.toThrow('worker crashed');
  });

  it('stops a queued job when its signal aborts', async () => {
    const controller = new AbortController();
    controller.abort();
    await expect(jobs.run(COUNT_UP, { n: 1 }, { signal: controller.signal })).rejects.toThrow(/abort/i);
  });
});

describe('workerFile', () => {
  it('resolves a sibling file with the caller\u2019s extension', () => {
    expect(workerFile('/app/server/models/model.service.ts', './ingest.job')).toBe('/app/server/models/ingest.job.ts');
    expect(workerFile('/app/dist/server/models/model.service.js', '../checks/check.job')).toBe('/app/dist/server/checks/check.job.js');
  });
});
