/**
 * Talks to the compose worker: newest request wins (answers to superseded ones are dropped).
 * Falls back to compose() on the main thread, after the paint, where workers are unavailable.
 */
import type { ComposeInput } from '../../../../shared/engine/compose.ts';
import type { FontRegistry, FontSource } from '../../../../shared/engine/fonts.ts';
import { type ComposeReply, type ComposeRequest, composeReply } from './compose-reply.ts';

export type { ComposeReply, ComposeRequest, ComposeResult } from './compose-reply.ts';

export class ComposeClient {
  private worker: Worker | null = null;
  private seq = 0;
  private handler: ((r: ComposeReply) => void) | null = null;
  /** one composition at a time: while the worker is busy only the newest input waits */
  private busy = false;
  private waiting: { id: number; input: ComposeInput } | null = null;

  constructor(
    private readonly registry: FontRegistry,
    sources: FontSource[],
  ) {
    try {
      this.worker = new Worker(new URL('./compose.worker.ts', import.meta.url), { type: 'module' });
      // structured clone copies the bytes; the page keeps its own
      this.worker.postMessage({ type: 'fonts', sources } satisfies ComposeRequest);
      this.worker.onmessage = (e: MessageEvent<ComposeReply>) => {
        this.busy = false;
        if (e.data.id === this.seq) this.handler?.(e.data);
        if (this.waiting) {
          const next = this.waiting;
          this.waiting = null;
          this.post(next.id, next.input);
        }
      };
      this.worker.onerror = () => {
        this.worker?.terminate();
        this.worker = null;
      };
    } catch {
      this.worker = null;
    }
  }

  onResult(handler: (r: ComposeReply) => void) {
    this.handler = handler;
  }

  /** Asks for a full composition; returns the request id the answer will carry. */
  request(input: ComposeInput): number {
    const id = ++this.seq;
    if (this.worker) {
      if (this.busy) this.waiting = { id, input };
      else this.post(id, input);
    } else {
      setTimeout(() => {
        if (id !== this.seq) return;
        this.handler?.(composeReply(this.registry, id, input));
      }, 50);
    }
    return id;
  }

  private post(id: number, input: ComposeInput) {
    this.busy = true;
    this.worker!.postMessage({ type: 'compose', id, input } satisfies ComposeRequest);
  }

  get current() {
    return this.seq;
  }

  dispose() {
    this.worker?.terminate();
    this.worker = null;
    this.handler = null;
  }
}
