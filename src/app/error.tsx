"use client";
import Link from "next/link";
import { useEffect, useState } from "react";
import { Button } from "@/components/ui/button";
import { DATA_STORE_RETRY_AFTER_S, DATA_STORE_UNAVAILABLE_DIGEST } from "@/contracts/data-store";

type State = "checking" | "unavailable" | "failed";

/** Whether the readiness probe says the database answers (a network failure counts as "no"). */
async function dataStoreAnswers(): Promise<boolean> {
  try {
    return (await fetch("/api/health/ready", { cache: "no-store" })).ok;
  } catch {
    return false;
  }
}

/**
 * What a page shows when it failed on the server. The guard tags a database outage (digest); any other
 * failure asks the readiness probe, since a page's later queries fail the same way. While the data store is
 * away the page looks again every few seconds and comes back by itself.
 */
export default function PageError({ error, retry }: { error: Error & { digest?: string }; retry: () => void }) {
  const tagged = error.digest === DATA_STORE_UNAVAILABLE_DIGEST;
  const [state, setState] = useState<State>(tagged ? "unavailable" : "checking");

  useEffect(() => {
    if (tagged) return;
    let live = true;
    void dataStoreAnswers().then((up) => live && setState(up ? "failed" : "unavailable"));
    return () => {
      live = false;
    };
  }, [tagged]);

  useEffect(() => {
    if (state !== "unavailable") return;
    const timer = setInterval(() => {
      void dataStoreAnswers().then((up) => up && retry());
    }, DATA_STORE_RETRY_AFTER_S * 1000);
    return () => clearInterval(timer);
  }, [state, retry]);

  if (state === "checking") {
    return (
      <main className="mx-auto max-w-xl px-6 py-16" aria-busy="true">
        <p className="text-ink-muted">Loading…</p>
      </main>
    );
  }
  const unavailable = state === "unavailable";
  return (
    <main className="mx-auto max-w-xl px-6 py-16">
      <div role="alert" className="rounded-lg border border-amber-300 bg-amber-50 p-5 text-amber-950">
        <h1 className="text-xl font-semibold">{unavailable ? "The data store is unavailable" : "This page could not be shown"}</h1>
        <p className="mt-2">
          {unavailable
            ? "Knucklebench cannot reach its database right now. Nothing was changed, and what you saved before is kept. This page tries again by itself every few seconds."
            : "Something went wrong on our side while preparing this page; nothing was changed."}
        </p>
        {!unavailable && error.digest ? <p className="mt-2 text-sm">Reference: {error.digest}</p> : null}
      </div>
      <div className="mt-5 flex gap-3">
        <Button type="button" onClick={retry}>Try again now</Button>
        <Link href="/" className="rounded-md border border-ink/20 bg-white px-3 py-1.5 text-sm font-medium hover:bg-ink/5">Home</Link>
      </div>
    </main>
  );
}
