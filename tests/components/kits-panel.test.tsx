import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { render, screen, waitFor, within } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { afterEach, describe, expect, it, vi } from "vitest";
import { KitsPanel } from "@/app/(app)/workspaces/[workspaceId]/kits/_components/kits-panel";

const kit = (id: string, name: string, version = 1) => ({
  id, name, scale: "1:10", notes: "", version, createdBy: "u1", createdByName: "Ada Stroud",
  createdAt: "2026-11-30T10:00:00.000Z", updatedAt: "2026-11-30T10:00:00.000Z",
});

function renderPanel(canWrite = true) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  return render(
    <QueryClientProvider client={client}>
      <KitsPanel workspaceId="ws1" workspaceName="Test bench" canWrite={canWrite} />
    </QueryClientProvider>,
  );
}

const json = (status: number, body: unknown) => new Response(JSON.stringify(body), { status, headers: { "content-type": "application/json" } });

afterEach(() => vi.unstubAllGlobals());

describe("kits panel", () => {
  it("shows a loading state, then the empty state", async () => {
    let resolve!: (r: Response) => void;
    vi.stubGlobal("fetch", vi.fn(() => new Promise<Response>((r) => (resolve = r))));
    renderPanel();
    expect(screen.getByText("Loading kits…")).toBeTruthy();
    resolve(json(200, { kits: [] }));
    await screen.findByText("No kits yet");
    expect(screen.getByText(/Create the first one/)).toBeTruthy();
  });

  it("shows the server's error and retries on request", async () => {
    const fetchMock = vi.fn()
      .mockResolvedValueOnce(json(403, { error: { code: "forbidden", message: "You are not a member of this workspace." } }))
      .mockResolvedValueOnce(json(200, { kits: [kit("k1", "Tern front")] }));
    vi.stubGlobal("fetch", fetchMock);
    renderPanel();
    const alert = await screen.findByRole("alert");
    expect(within(alert).getByText("You are not a member of this workspace.")).toBeTruthy();
    await userEvent.click(within(alert).getByRole("button", { name: "Try again" }));
    await screen.findByText("Tern front");
    expect(fetchMock).toHaveBeenCalledTimes(2);
  });

  it("validates the create form before sending and shows the field reason", async () => {
    const fetchMock = vi.fn().mockResolvedValue(json(200, { kits: [] }));
    vi.stubGlobal("fetch", fetchMock);
    renderPanel();
    await screen.findByText("No kits yet");
    await userEvent.click(screen.getByRole("button", { name: "Create kit" }));
    await screen.findByText("Name is required");
    expect(fetchMock).toHaveBeenCalledTimes(1); // only the list
  });

  it("sends a rename with the version it was based on; Escape cancels", async () => {
    const fetchMock = vi.fn(async (url: string, init?: RequestInit) => {
      if (init?.method === "PATCH") return json(200, { kit: { ...kit("k1", JSON.parse(String(init.body)).name, 4), layout: {} } });
      return json(200, { kits: [kit("k1", "Tern front", 3)] });
    });
    vi.stubGlobal("fetch", fetchMock);
    renderPanel();
    await userEvent.click(await screen.findByRole("button", { name: "Rename Tern front" }));
    expect(screen.getByLabelText("New name for Tern front")).toBeTruthy();
    await userEvent.keyboard("{Escape}");
    expect(screen.queryByLabelText("New name for Tern front")).toBeNull();
    await userEvent.click(screen.getByRole("button", { name: "Rename Tern front" }));
    await userEvent.clear(screen.getByLabelText("New name for Tern front"));
    await userEvent.type(screen.getByLabelText("New name for Tern front"), "Tern front B{Enter}");
    await waitFor(() => expect(fetchMock.mock.calls.some(([, i]) => i?.method === "PATCH")).toBe(true));
    const patch = fetchMock.mock.calls.find(([, i]) => i?.method === "PATCH")!;
    expect(patch[0]).toBe("/api/workspaces/ws1/kits/k1");
    expect(JSON.parse(String(patch[1]!.body))).toEqual({ version: 3, name: "Tern front B" });
  });

  it("hides the write controls from a viewer", async () => {
    vi.stubGlobal("fetch", vi.fn().mockResolvedValue(json(200, { kits: [kit("k1", "Tern front")] })));
    renderPanel(false);
    await screen.findByText("Tern front");
    expect(screen.queryByRole("button", { name: /Rename/ })).toBeNull();
    expect(screen.queryByRole("form", { name: "New kit" })).toBeNull();
    expect(screen.getByText(/Ask an admin for the editor role/)).toBeTruthy();
  });
});
