/**
 * A worker thread of the build (pool.ts): makes its own session with the options it was given,
 * loads the project once, and answers each job (`Job` in session.ts) with plain data. The session's
 * modules load after Node's compile cache is on, as in the main thread (scripts/build.ts).
 */
import { enableCompileCache } from 'node:module';
import { parentPort, workerData } from 'node:worker_threads';
import type { Reply } from './pool.ts';
import type { Job, JobResult, SessionOptions } from './session.ts';

enableCompileCache();
const { GloamingSession } = await import('./session.ts');
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
