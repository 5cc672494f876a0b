/**
 * A worker thread of the build (pool.ts): makes its own session with the options it was given,
 * loads the project once, and answers each job (`Job` in session.ts) with plain data.
 */
import { parentPort, workerData } from 'node:worker_threads';
import type { Reply } from './pool.ts';
import { GloamingSession, type Job, type JobResult, type SessionOptions } from './session.ts';

const session = new GloamingSession(workerData as SessionOptions);
parentPort!.on('message', (job: Job) => {
  session.runJob(job).then(
    (ok) => parentPort!.postMessage({ ok } satisfies Reply<JobResult>),
    (error: unknown) => {
      const e = error instanceof Error ? error : new Error(String(error));
      parentPort!.postMessage({ error: { message: e.message, ...(e.stack ? { stack: e.stack } : {}) } } satisfies Reply<JobResult>);
    },
  );
});
