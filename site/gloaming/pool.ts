/**
 * A small pool of worker threads for the build's computation (both cores: bulletin pages, site
 * entries and social cards). Workers are started on first use, each runs `worker.ts` with the
 * session's options (and loads the project once), and take jobs one at a time from one queue, so
 * a slow job does not hold up the others. A job's failure rejects its promise with the worker's
 * message and stack; idle workers do not keep the process alive.
 */
import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';

interface Waiting<J, R> {
  job: J;
  done: (result: R) => void;
  fail: (error: Error) => void;
}

/** What a worker answers for one job. */
export type Reply<R> = { ok: R } | { error: { message: string; stack?: string } };

export class WorkerPool<J, R> {
  readonly size: number;
  readonly #url: URL;
  readonly #workerData: unknown;
  readonly #queue: Waiting<J, R>[] = [];
  readonly #idle: Worker[] = [];
  readonly #all: Worker[] = [];

  /** `size` defaults to the cores Node may use (`os.availableParallelism()`). */
  constructor(url: URL, workerData: unknown, size = availableParallelism()) {
    this.#url = url;
    this.#workerData = workerData;
    this.size = Math.max(1, size);
  }

  /** Runs `job` on the next free worker. */
  run(job: J): Promise<R> {
    return new Promise<R>((done, fail) => {
      this.#queue.push({ job, done, fail });
      this.#next();
    });
  }

  /** Stops every worker (jobs still queued are rejected). */
  async close(): Promise<void> {
    for (const w of this.#queue.splice(0)) w.fail(new Error('the worker pool was closed'));
    const all = this.#all.splice(0);
    this.#idle.length = 0;
    await Promise.all(all.map((w) => w.terminate()));
  }

  #next(): void {
    if (this.#queue.length === 0) return;
    let worker = this.#idle.pop();
    if (!worker) {
      if (this.#all.length >= this.size) return;
      worker = new Worker(this.#url, { workerData: this.#workerData });
      worker.unref();
      this.#all.push(worker);
    }
    const waiting = this.#queue.shift()!;
    const w = worker;
    const onMessage = (reply: Reply<R>): void => {
      w.off('error', onError);
      if ('ok' in reply) waiting.done(reply.ok);
      else waiting.fail(Object.assign(new Error(reply.error.message), reply.error.stack ? { stack: reply.error.stack } : {}));
      this.#idle.push(w);
      this.#next();
    };
    const onError = (error: Error): void => {
      w.off('message', onMessage);
      this.#all.splice(this.#all.indexOf(w), 1);
      waiting.fail(error);
      this.#next();
    };
    w.once('message', onMessage);
    w.once('error', onError);
    w.postMessage(waiting.job);
  }
}
