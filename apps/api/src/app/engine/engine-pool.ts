import { availableParallelism } from 'node:os';
import { Piscina } from 'piscina';
import type { AnalysisResult, AnalysisSpec } from '@tallyfit/engine';
import { HttpError, unavailable } from '../http/http-error';
import { engineLane, type EngineLane } from './engine-job-size';
import { FairQueue } from './fair-queue';
import { unwrapOutcome, type EngineRunOptions, type EngineRunner, type EngineTaskOutcome } from './engine-runner';

export interface EnginePoolOptions {
  /** The built worker script (engine-worker.js beside main.js). */
  workerFile: string;
  /** Longest one run may compute, counted from when it starts on a thread. */
  timeLimitMs: number;
  /** Longest a run may wait for a thread before it is refused as queued too long (default: the time limit). */
  queueWaitLimitMs?: number;
  /** Threads for runs that may be long (default: all cores but one). */
  largeThreads?: number;
  /** Threads kept for small runs, so ordinary analyses never wait behind long ones (default 1). */
  smallThreads?: number;
  /** Runs waiting in one lane beyond this are refused at once rather than queued without end. */
  maxQueue?: number;
}

interface Job {
  spec: AnalysisSpec;
  owner: string;
  resolve(result: AnalysisResult): void;
  reject(error: unknown): void;
  waitTimer?: NodeJS.Timeout;
}

interface Lane {
  name: EngineLane;
  pool: Piscina;
  threads: number;
  running: number;
  queue: FairQueue<Job>;
}

/** Owner of runs that come without a person (scripts through the in-process seam never get here). */
const NO_OWNER = 'anonymous';

/**
 * Engine runs in worker threads so a long exact test never blocks the event loop. Runs wait in
 * this module's own queues, not piscina's, so that (1) the time limit counts from when a run
 * starts computing, (2) people take turns (one person's twenty long runs do not stall another's),
 * and (3) small runs have their own thread and never queue behind long ones; a small run may also
 * borrow an idle large thread. A run that exceeds its time limit is aborted, which ends its worker
 * thread (piscina starts a fresh one), so nothing keeps computing after the answer.
 */
export function createEnginePool(options: EnginePoolOptions): EngineRunner {
  const largeThreads = options.largeThreads ?? Math.max(1, availableParallelism() - 1);
  const smallThreads = options.smallThreads ?? 1;
  const queueWaitLimitMs = options.queueWaitLimitMs ?? options.timeLimitMs;
  const seconds = (ms: number) => `${Number((ms / 1000).toPrecision(3))} s`;

  const lane = (name: EngineLane, threads: number): Lane => ({
    name,
    threads,
    running: 0,
    queue: new FairQueue<Job>(),
    pool: new Piscina({
      filename: options.workerFile,
      name: 'analyzeSpec',
      minThreads: threads,
      maxThreads: threads,
      idleTimeout: Infinity,
    }),
  });
  const lanes: Record<EngineLane, Lane> = { small: lane('small', smallThreads), large: lane('large', largeThreads) };
  const maxQueue = options.maxQueue ?? 64 * (smallThreads + largeThreads);
  let closed = false;

  const start = (on: Lane, job: Job) => {
    clearTimeout(job.waitTimer);
    on.running += 1;
    const controller = new AbortController();
    const timer = setTimeout(() => controller.abort(), options.timeLimitMs);
    on.pool
      .run(job.spec, { signal: controller.signal })
      .then((outcome) => job.resolve(unwrapOutcome(outcome as EngineTaskOutcome)))
      .catch((error: unknown) => {
        if (!controller.signal.aborted) return job.reject(error);
        job.reject(
          new HttpError(
            422,
            'too_much_work',
            `the analysis did not finish within ${seconds(options.timeLimitMs)} of computing; ask the exact test for Monte Carlo (exact.method "monte-carlo") or fewer samples`,
          ),
        );
      })
      .finally(() => {
        clearTimeout(timer);
        on.running -= 1;
        pump();
      });
  };

  /** Fills free threads: the small lane from small runs; the large lane from large runs, then small ones. */
  const pump = () => {
    const { small, large } = lanes;
    while (small.running < small.threads && small.queue.size) start(small, small.queue.shift()!);
    while (large.running < large.threads && (large.queue.size || small.queue.size)) {
      start(large, (large.queue.size ? large.queue : small.queue).shift()!);
    }
  };

  const enqueue = (job: Job, laneName: EngineLane) => {
    const { small, large } = lanes;
    if (laneName === 'small' && small.running < small.threads) return start(small, job);
    if (large.running < large.threads && !large.queue.size) return start(large, job);
    const queue = lanes[laneName].queue;
    if (queue.size >= maxQueue) {
      return job.reject(unavailable('busy', 'the engine is busy; try again in a moment', options.timeLimitMs / 1000));
    }
    queue.push(job.owner, job);
    job.waitTimer = setTimeout(() => {
      if (!queue.remove(job.owner, job)) return;
      job.reject(
        unavailable(
          'queued_too_long',
          `the engine was busy with other analyses and this one waited ${seconds(queueWaitLimitMs)} without starting; nothing was computed, try again later`,
          options.timeLimitMs / 1000,
        ),
      );
    }, queueWaitLimitMs);
  };

  return {
    analyze: (spec: AnalysisSpec, run: EngineRunOptions = {}): Promise<AnalysisResult> => {
      if (closed) return Promise.reject(unavailable('shutting_down', 'the server is shutting down', 5));
      return new Promise<AnalysisResult>((resolve, reject) => {
        enqueue({ spec, owner: run.owner ?? NO_OWNER, resolve, reject }, engineLane(spec));
      });
    },
    close: async () => {
      closed = true;
      for (const { queue } of Object.values(lanes)) {
        for (const job of queue.drain()) {
          clearTimeout(job.waitTimer);
          job.reject(unavailable('shutting_down', 'the server is shutting down', 5));
        }
      }
      await Promise.all(Object.values(lanes).map(({ pool }) => pool.destroy()));
    },
  };
}
