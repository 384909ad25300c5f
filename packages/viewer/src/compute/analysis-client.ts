import AnalysisWorker from "./analysis-worker.ts?worker&inline";
import type { WorkerError, WorkerReply, WorkerRequest, WorkerResult } from "./worker-protocol.js";

/** An error the worker reported, with the reader's position when there is one. */
export class AnalysisError extends Error {
  readonly detail: WorkerError;
  constructor(detail: WorkerError) {
    super(detail.message);
    this.name = detail.name;
    this.detail = detail;
  }
}

/** Requests to the analysis worker as promises, answered in order of arrival. */
export class AnalysisClient {
  private readonly worker: Worker = new AnalysisWorker();
  private nextId = 1;
  private failure: AnalysisError | null = null;
  private readonly waiting = new Map<
    number,
    { resolve: (r: WorkerResult) => void; reject: (e: Error) => void }
  >();

  constructor() {
    this.worker.onmessage = (event: MessageEvent<WorkerReply>) => {
      const reply = event.data;
      const pending = this.waiting.get(reply.id);
      if (!pending) return;
      this.waiting.delete(reply.id);
      if (reply.ok) pending.resolve(reply.result);
      else pending.reject(new AnalysisError(reply.error));
    };
    this.worker.onerror = (event) => {
      // A worker that failed to load fails every request, now and later, instead of leaving them waiting.
      this.failure = new AnalysisError({
        name: "WorkerError",
        message: `the page's computing worker failed${event.message ? `: ${event.message}` : " to start"}`,
      });
      for (const pending of this.waiting.values()) pending.reject(this.failure);
      this.waiting.clear();
    };
  }

  request<T extends WorkerResult>(request: WorkerRequest, transfer: Transferable[] = []): Promise<T> {
    const id = this.nextId++;
    if (this.failure) return Promise.reject(this.failure);
    return new Promise<T>((resolve, reject) => {
      this.waiting.set(id, { resolve: resolve as (r: WorkerResult) => void, reject });
      this.worker.postMessage({ id, ...request }, transfer);
    });
  }
}
