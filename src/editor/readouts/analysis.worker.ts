// The editor's analysis worker: the engine runs here so dragging never waits on it.
import { answerAnalysisRequest, type AnalysisRequest } from "./analysis-protocol";

const scope = self as unknown as { onmessage: ((e: MessageEvent<AnalysisRequest>) => void) | null; postMessage(m: unknown): void };

scope.onmessage = (event) => {
  scope.postMessage(answerAnalysisRequest(event.data));
};
