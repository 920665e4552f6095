// src/app/error.tsx: what a page that failed on the server shows, and that it comes back by itself once the
// data store answers again (the readiness probe is the browser's fetch, stubbed here).
import { render, screen } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import PageError from "@/app/error";
import { DATA_STORE_UNAVAILABLE_DIGEST } from "@/contracts/data-store";

const ready = (status: number) => new Response(JSON.stringify({ ok: status === 200 }), { status });
const failure = (digest?: string) => Object.assign(new Error("An error occurred in the Server Components render."), { digest });

afterEach(() => {
  vi.useRealTimers();
  vi.unstubAllGlobals();
});

describe("page error state", () => {
  it("shows the data store as unavailable when the guard tagged the failure, without asking", () => {
    const fetchMock = vi.fn();
    vi.stubGlobal("fetch", fetchMock);
    render(<PageError error={failure(DATA_STORE_UNAVAILABLE_DIGEST)} retry={() => {}} />);
    expect(screen.getByRole("heading", { level: 1 }).textContent).toBe("The data store is unavailable");
    expect(screen.getByRole("alert").textContent).toContain("Nothing was changed");
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it("asks the readiness probe about any other failure: 503 reads as the data store unavailable", async () => {
    const fetchMock = vi.fn().mockResolvedValue(ready(503));
    vi.stubGlobal("fetch", fetchMock);
    render(<PageError error={failure("1234567")} retry={() => {}} />);
    await screen.findByRole("heading", { name: "The data store is unavailable" });
    expect(fetchMock).toHaveBeenCalledWith("/api/health/ready", { cache: "no-store" });
  });

  it("with the data store answering, it is a failure of ours, with its reference", async () => {
    vi.stubGlobal("fetch", vi.fn().mockResolvedValue(ready(200)));
    render(<PageError error={failure("1234567")} retry={() => {}} />);
    await screen.findByRole("heading", { name: "This page could not be shown" });
    expect(screen.getByText("Reference: 1234567")).toBeTruthy();
  });

  it("retries by itself once the readiness probe answers 200 again", async () => {
    vi.useFakeTimers();
    const fetchMock = vi.fn().mockResolvedValueOnce(ready(503)).mockResolvedValueOnce(ready(200));
    vi.stubGlobal("fetch", fetchMock);
    const retry = vi.fn();
    render(<PageError error={failure(DATA_STORE_UNAVAILABLE_DIGEST)} retry={retry} />);
    await vi.advanceTimersByTimeAsync(5_000);
    expect(retry).not.toHaveBeenCalled(); // still 503
    await vi.advanceTimersByTimeAsync(5_000);
    expect(retry).toHaveBeenCalledTimes(1);
    expect(fetchMock).toHaveBeenCalledTimes(2);
  });
});
