/**
 * The server's worker-thread pool (piscina): motif parsing, compose, text layout on a cache miss,
 * nesting, work sheet PDFs and image re-encoding run here, never on the request thread, so one
 * heavy request cannot stop the server answering others. Each task has a time limit; a task past
 * it is aborted, which terminates its worker thread (piscina starts a fresh one), and the request
 * gets a clear 503. Each worker's heap is capped too, so a runaway task ends that thread, not the
 * process. The pool starts its threads on first use and is closed when the server stops.
 */
import os from 'node:os';
import { fileURLToPath } from 'node:url';
import { MessageChannel, type Transferable } from 'node:worker_threads';
import { Piscina } from 'piscina';
import { ComposeError } from '../../shared/engine/compose.ts';
import { CutSheetError } from '../../shared/engine/cut-sheets.ts';
import { MotifError, type MotifErrorCode } from '../../shared/engine/motif.ts';
import { LayoutError } from '../../shared/engine/text-layout.ts';
import { AppError } from '../http/app-error.ts';
import type { Task, TaskError, TaskKind, TaskMessage, TaskResult, TaskValue } from './tasks.ts';

export type { Task, TaskKind, TaskValue } from './tasks.ts';

export type WorkPoolOptions = {
  /** Time limit of one task from when a worker starts on it, ms. Default 20 s. */
  timeoutMs?: number;
  /** Longest a task may wait for a free worker before it is refused as busy, ms. Default 60 s. */
  maxWaitMs?: number;
  /** Threads: default one less than the machine's parallelism (the request thread keeps one), 2 to 4. */
  maxThreads?: number;
  /** Tasks waiting for a thread before new ones are refused as busy. Default 64. */
  maxQueue?: number;
  /** Heap cap of each worker thread, MB. Default 512. */
  maxHeapMb?: number;
};

export type RunOptions = { timeoutMs?: number; transferList?: Transferable[] };

export type WorkPool = {
  run<K extends TaskKind>(task: Extract<Task, { kind: K }>, opts?: RunOptions): Promise<TaskValue[K]>;
  /** Builds a work sheet PDF in a worker; `onProgress` hears the fraction of pages done. */
  worksheet(input: Extract<Task, { kind: 'worksheet' }>['input'], onProgress?: (fraction: number) => void): Promise<Buffer>;
  /** Starts every thread now and keeps them (the server calls this at start-up, so no request waits for one). */
  warm(): void;
  /** Worker threads running now (0 before first use). */
  readonly threadIds: number[];
  close(): Promise<void>;
};

export const DEFAULT_TASK_TIMEOUT_MS = 20_000;

/** What the shopper or seller is told per kind of work when its time is up. */
const WHAT: Record<TaskKind, string> = {
  motif: 'This motif took too long to prepare',
  layout: 'This text took too long to prepare',
  compose: 'This design took too long to prepare',
  nest: 'These cut sheets took too long to nest',
  worksheet: 'This work sheet took too long to build',
  image: 'This image took too long to prepare',
  template: 'This placement template took too long to build',
};

const WORKER = fileURLToPath(new URL('./worker.mjs', import.meta.url));

function defaultThreads(): number {
  const n = typeof os.availableParallelism === 'function' ? os.availableParallelism() : os.cpus().length;
  // at least 2, so one long task never queues every other design behind it
  return Math.max(2, Math.min(4, n - 1));
}

/** An error sent back as data by a worker → the same class on this thread. */
function rebuild(e: TaskError): Error {
  switch (e.name) {
    case 'AppError':
      return new AppError(e.status ?? 500, e.code ?? 'error', e.message, e.fields);
    case 'MotifError':
      return new MotifError(e.code as MotifErrorCode, e.message);
    case 'LayoutError':
      return new LayoutError(e.message);
    case 'ComposeError':
      return new ComposeError(e.fieldId ?? '', e.message);
    case 'CutSheetError':
      return new CutSheetError(e.code as CutSheetError['code'], e.message, e.fields);
    // a bound of shared/engine/limits.ts: the input is refused, and the message names the bound
    case 'LimitError':
      return new AppError(400, 'limit_exceeded', e.message, { limit: e.limit ?? '' });
    default:
      return new Error(`A background task failed: ${e.message}`);
  }
}

export function createWorkPool(opts: WorkPoolOptions = {}): WorkPool {
  const timeoutMs = opts.timeoutMs ?? DEFAULT_TASK_TIMEOUT_MS;
  const maxWaitMs = opts.maxWaitMs ?? 60_000;
  const maxThreads = opts.maxThreads ?? defaultThreads();
  let piscina: Piscina | null = null;
  let closed = false;
  const get = (warm = false): Piscina => {
    if (closed) throw new AppError(503, 'shutting_down', 'The server is shutting down. Please try again in a moment.');
    piscina ??= new Piscina({
      filename: WORKER,
      minThreads: warm ? maxThreads : 0,
      maxThreads,
      maxQueue: opts.maxQueue ?? 64,
      idleTimeout: 60_000,
      // workers run at a lower priority than the request thread: when the CPU is short, answering
      // requests comes first and geometry waits (Linux; ignored where thread priority is not set)
      niceIncrement: 10,
      // a clean worker: it registers tsx itself (worker.mjs), whatever loader flags this process has
      execArgv: [],
      resourceLimits: { maxOldGenerationSizeMb: opts.maxHeapMb ?? 512 },
    });
    return piscina;
  };

  async function run<K extends TaskKind>(task: Extract<Task, { kind: K }>, ro: RunOptions = {}): Promise<TaskValue[K]> {
    const pool = get();
    const limit = ro.timeoutMs ?? timeoutMs;
    // Two clocks: the wait for a free worker (bounded, answered as busy), then the task's own time
    // limit, started when the worker says it has begun. Either ends the task through one signal.
    const ac = new AbortController();
    let why: 'wait' | 'limit' | null = null;
    let limitTimer: NodeJS.Timeout | undefined;
    const waitTimer = setTimeout(() => ((why = 'wait'), ac.abort()), maxWaitMs);
    const { port1, port2 } = new MessageChannel();
    port1.once('message', () => {
      clearTimeout(waitTimer);
      limitTimer = setTimeout(() => ((why = 'limit'), ac.abort()), limit);
    });
    const message: TaskMessage = { task, started: port2 };
    let res: TaskResult<K>;
    try {
      res = (await pool.run(message, { signal: ac.signal, transferList: [port2, ...(ro.transferList ?? [])] })) as TaskResult<K>;
    } catch (e) {
      if (why === 'limit') {
        throw new AppError(503, 'task_timeout', `${WHAT[task.kind]} (over ${formatSeconds(limit)}), so we stopped. Try something simpler, or try again in a moment.`);
      }
      if (why === 'wait' || (e instanceof Error && /queue is at limit/i.test(e.message))) {
        throw new AppError(503, 'busy', 'The server is busy preparing other designs. Please try again in a moment.');
      }
      // the worker itself died (e.g. its heap cap): report it as the task failing, not the server
      if (e instanceof Error && /terminated|ERR_WORKER_OUT_OF_MEMORY|out of memory/i.test(`${e.message} ${(e as { code?: string }).code ?? ''}`)) {
        throw new AppError(422, 'task_failed', `${WHAT[task.kind].replace(/took too long to \w+/, 'could not be prepared')}: it needs more memory than we allow.`);
      }
      throw e;
    } finally {
      clearTimeout(waitTimer);
      clearTimeout(limitTimer);
      port1.close();
    }
    if (!res.ok) throw rebuild(res.error);
    return res.value;
  }

  return {
    run,
    async worksheet(input, onProgress) {
      if (!onProgress) return toBuffer(await run({ kind: 'worksheet', input }));
      const { port1, port2 } = new MessageChannel();
      port1.on('message', (f: number) => onProgress(f));
      try {
        return toBuffer(await run({ kind: 'worksheet', input, progress: port2 }, { transferList: [port2] }));
      } finally {
        port1.close();
      }
    },
    warm() {
      get(true);
    },
    get threadIds() {
      return piscina ? piscina.threads.map((t) => t.threadId) : [];
    },
    async close() {
      closed = true;
      const p = piscina;
      piscina = null;
      await p?.destroy();
    },
  };
}

const formatSeconds = (ms: number) => (ms >= 1000 ? `${Math.round(ms / 100) / 10} s` : `${ms} ms`);
const toBuffer = (u: Uint8Array) => (Buffer.isBuffer(u) ? u : Buffer.from(u.buffer, u.byteOffset, u.byteLength));
