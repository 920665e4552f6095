// The editor's side of the worker protocol: one request in flight at a time, and while it runs only the
// newest waiting request is kept (the pointer can outrun the worker; only the latest layout matters).
// Replies come back in the order sent; a reply older than one already delivered (answered on this thread,
// see answerHere) is dropped, so what is delivered only ever gets newer.
import { answerAnalysisRequest, type AnalysisQuality, type AnalysisReply, type AnalysisRequest } from "./analysis-protocol";

/** A Worker, a MessagePort, or anything else that carries the messages both ways. */
export interface AnalysisPort {
  postMessage(message: AnalysisRequest): void;
  onmessage: ((event: MessageEvent<AnalysisReply>) => void) | null;
}

export interface AnalysisClient {
  /** Asks for an analysis of `layout`; returns the request id. */
  request(layout: unknown, quality: AnalysisQuality): number;
  /**
   * Answers at once on this thread, as the newest request (a waiting one is dropped). Only for work known
   * to take a small part of a frame: a worker's reply lands a frame after the input that asked for it.
   */
  answerHere(layout: unknown, quality: AnalysisQuality): AnalysisReply;
  /** Id of the newest request made. */
  latestId(): number;
  /** How many requests were dropped for a newer one (the bench reports it). */
  droppedCount(): number;
  close(): void;
}

export function createAnalysisClient(port: AnalysisPort, onReply: (reply: AnalysisReply, isLatest: boolean) => void): AnalysisClient {
  let nextId = 1;
  let latest = 0;
  let inFlight: number | null = null;
  let waiting: AnalysisRequest | null = null;
  let dropped = 0;
  let delivered = 0;
  let closed = false;

  const deliver = (reply: AnalysisReply) => {
    if (reply.id <= delivered) return;
    delivered = reply.id;
    onReply(reply, reply.id === latest);
  };

  const send = (req: AnalysisRequest) => {
    inFlight = req.id;
    port.postMessage(req);
  };

  port.onmessage = (event) => {
    if (closed) return;
    const reply = event.data;
    if (reply.id === inFlight) inFlight = null;
    deliver(reply);
    if (inFlight === null && waiting) {
      const next = waiting;
      waiting = null;
      send(next);
    }
  };

  return {
    request(layout, quality) {
      const req: AnalysisRequest = { type: "analyze", id: nextId++, quality, layout };
      latest = req.id;
      if (inFlight === null) send(req);
      else {
        if (waiting) dropped++;
        waiting = req;
      }
      return req.id;
    },
    answerHere(layout, quality) {
      const req: AnalysisRequest = { type: "analyze", id: nextId++, quality, layout };
      latest = req.id;
      if (waiting) dropped++;
      waiting = null;
      const reply = answerAnalysisRequest(req);
      if (!closed) deliver(reply);
      return reply;
    },
    latestId: () => latest,
    droppedCount: () => dropped,
    close() {
      closed = true;
      port.onmessage = null;
    },
  };
}

/** Starts the analysis worker; where the browser cannot (no Worker), answers on this thread instead. */
export function startAnalysisPort(): { port: AnalysisPort; stop(): void } {
  if (typeof Worker !== "undefined") {
    const worker = new Worker(new URL("./analysis.worker.ts", import.meta.url), { type: "module", name: "kit-analysis" });
    return { port: worker as unknown as AnalysisPort, stop: () => worker.terminate() };
  }
  const port: AnalysisPort = {
    onmessage: null,
    postMessage(message) {
      queueMicrotask(() => port.onmessage?.({ data: answerAnalysisRequest(message) } as MessageEvent<AnalysisReply>));
    },
  };
  return { port, stop: () => {} };
}
