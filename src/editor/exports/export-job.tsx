"use client";
// One export at a time, wherever files are made (the editor's Export menu, the compare page's sheets): the
// job's progress — nothing known while the server makes the file, then the share received —, a way to stop
// it, then what was saved or why not, in one live status line.
import { useState } from "react";
import { downloadExport, type ExportProgress } from "./fetch-export";

type Job = { readonly label: string; readonly progress: ExportProgress; readonly abort: AbortController };
type Outcome = { readonly ok: boolean; readonly text: string };

export interface ExportJobRequest {
  readonly url: string;
  /** What the status says while the file is made ("Making the dimension sheet…"). */
  readonly label: string;
  /** The file's name if the server gives none. */
  readonly fallbackName: string;
  /** What the status says once saved, from the file's name. */
  readonly saved?: (name: string) => string;
}

export interface ExportJob {
  readonly job: Job | null;
  readonly outcome: Outcome | null;
  readonly busy: boolean;
  /** Starts a download unless one is running. */
  start(request: ExportJobRequest): Promise<void>;
}

export function useExportJob(): ExportJob {
  const [job, setJob] = useState<Job | null>(null);
  const [outcome, setOutcome] = useState<Outcome | null>(null);

  const start = async ({ url, label, fallbackName, saved = (name) => `Saved ${name}.` }: ExportJobRequest) => {
    if (job) return;
    const abort = new AbortController();
    setOutcome(null);
    setJob({ label, progress: { phase: "making" }, abort });
    try {
      const name = await downloadExport(url, fallbackName, (progress) => setJob((j) => (j ? { ...j, progress } : j)), abort.signal);
      setOutcome({ ok: true, text: saved(name) });
    } catch (error) {
      setOutcome((error as Error).name === "AbortError" ? { ok: false, text: "Export stopped." } : { ok: false, text: `Not exported: ${(error as Error).message}` });
    } finally {
      setJob(null);
    }
  };

  return { job, outcome, busy: job !== null, start };
}

/** The job's live status: its label and progress bar with Stop while it runs, then its outcome. */
export function ExportJobStatus({ state, testId = "export-status", className = "" }: { state: ExportJob; testId?: string; className?: string }) {
  const { job, outcome } = state;
  const fraction = job?.progress.phase === "receiving" ? job.progress.fraction : null;
  return (
    <div role="status" aria-live="polite" data-testid={testId} className={`flex items-center gap-1.5 text-xs ${className}`}>
      {job ? (
        <>
          <span>{job.label}</span>
          {/* No value while the server works (indeterminate), then the share received. */}
          <progress aria-label={job.label} className="h-1.5 w-20" max={1} value={fraction ?? undefined} />
          <button type="button" className="rounded px-1 text-steel underline" onClick={() => job.abort.abort()}>Stop</button>
        </>
      ) : outcome ? (
        <span className={outcome.ok ? "text-ink-muted" : "text-red-700"}>{outcome.text}</span>
      ) : null}
    </div>
  );
}
