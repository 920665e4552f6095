// The library page's client part with the network and the router stubbed: loading, empty and error
// states, readouts marked against the targets, sorting and columns written to the URL, picking kits to
// compare (four at most), the new-kit form's own validation, and what a viewer does not get.
import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { render, screen, waitFor, within } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { DEFAULT_TARGETS } from "@/contracts/targets";

const router = { replace: vi.fn(), push: vi.fn(), refresh: vi.fn() };
let search = new URLSearchParams();
vi.mock("next/navigation", () => ({
  useRouter: () => router,
  usePathname: () => "/workspaces/ws1/kits",
  useSearchParams: () => search,
}));

const { LibraryPanel } = await import("@/app/(app)/workspaces/[workspaceId]/kits/_components/library-panel");

const kit = (id: string, name: string, readouts: Partial<Record<string, number | null>> = {}, extra: Record<string, unknown> = {}) => ({
  id, name, scale: "1:10", notes: "", version: 3, createdBy: "u1", createdByName: "Ada Stroud",
  createdAt: "2026-11-30T10:00:00.000Z", updatedAt: "2026-11-30T10:00:00.000Z",
  tags: ["steel"], headRevision: 3, archivedAt: null, originKitId: null, originKitName: null, originRevision: null, targetOverrides: {},
  readouts: { lockDeg: 33.2, maxJointAngleDeg: 24.1, ackermannPct: 41, safetyFactor: 2.6, neckClearanceMm: 0.4, ...readouts },
  lockLimitedBy: "neck-contact", ...extra,
});
const page = (kits: unknown[], total = kits.length) => ({ kits, total, page: 1, size: 50, targets: DEFAULT_TARGETS });
const json = (status: number, body: unknown) => new Response(JSON.stringify(body), { status, headers: { "content-type": "application/json" } });
const FACETS = { tags: [{ tag: "steel", count: 2 }], authors: [{ id: "u1", name: "Ada Stroud", count: 2 }] };

function stubApi(list: (url: string) => Response | Promise<Response>) {
  const fetchMock = vi.fn(async (url: string, init?: RequestInit) => {
    if (url.endsWith("/kits/facets")) return json(200, FACETS);
    if (init?.method && init.method !== "GET") return json(200, { kit: kit("k9", "new", {}, { layout: {} }) });
    return list(url);
  });
  vi.stubGlobal("fetch", fetchMock);
  return fetchMock;
}

function renderPanel(canWrite = true) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  return render(
    <QueryClientProvider client={client}>
      <LibraryPanel workspaceId="ws1" workspaceName="Test bench" canWrite={canWrite} />
    </QueryClientProvider>,
  );
}

beforeEach(() => {
  search = new URLSearchParams();
  router.replace.mockClear();
});
afterEach(() => vi.unstubAllGlobals());

describe("library panel", () => {
  it("shows a loading state, then the empty state", async () => {
    let resolve!: (r: Response) => void;
    stubApi(() => new Promise<Response>((r) => (resolve = r)));
    renderPanel();
    expect(screen.getByText("Loading kits…")).toBeTruthy();
    resolve(json(200, page([])));
    await screen.findByText("No kits yet");
  });

  it("shows the server's error and retries on request", async () => {
    const fetchMock = stubApi(vi.fn()
      .mockResolvedValueOnce(json(403, { error: { code: "forbidden", message: "You are not a member of this workspace." } }))
      .mockResolvedValueOnce(json(200, page([kit("k1", "Tern front")]))));
    renderPanel();
    const alert = await screen.findByRole("alert");
    expect(within(alert).getByText("You are not a member of this workspace.")).toBeTruthy();
    await userEvent.click(within(alert).getByRole("button", { name: "Try again" }));
    await screen.findByText("Tern front");
    expect(fetchMock.mock.calls.filter(([u]) => !String(u).endsWith("facets"))).toHaveLength(2);
  });

  it("asks the server for the URL's view and marks each readout against the targets, not by colour alone", async () => {
    search = new URLSearchParams("sort=safetyFactor&dir=asc&tags=steel");
    const fetchMock = stubApi(() => json(200, page([kit("k1", "Tern front", { safetyFactor: 1.4, lockDeg: 33.2 })])));
    renderPanel();
    await screen.findByText("Tern front");
    expect(fetchMock.mock.calls.map(([u]) => String(u))).toContain("/api/workspaces/ws1/kits?tags=steel&sort=safetyFactor&dir=asc");
    const row = screen.getByRole("row", { name: /Tern front/ });
    expect(within(row).getByText(/misses the target ≥ 2/)).toBeTruthy();
    expect(within(row).getByText(/meets the target ≥ 30°/)).toBeTruthy();
    expect(screen.getByRole("columnheader", { name: /Safety factor/ }).getAttribute("aria-sort")).toBe("ascending");
  });

  it("writes a header's sort and the columns shown to the URL", async () => {
    stubApi(() => json(200, page([kit("k1", "Tern front")])));
    renderPanel();
    await screen.findByText("Tern front");
    await userEvent.click(screen.getByTestId("sort-lockDeg"));
    expect(router.replace).toHaveBeenLastCalledWith("/workspaces/ws1/kits?sort=lockDeg", { scroll: false });
    await userEvent.click(screen.getByText("Columns"));
    await userEvent.click(screen.getByRole("checkbox", { name: "Ackermann" }));
    expect(router.replace).toHaveBeenLastCalledWith("/workspaces/ws1/kits?cols=name%2Cscale%2Cauthor%2CupdatedAt%2ClockDeg%2CmaxJointAngleDeg%2CsafetyFactor%2CneckClearanceMm", { scroll: false });
  });

  it("picks two to four kits to compare, and no fifth", async () => {
    stubApi(() => json(200, page(["a", "b", "c", "d", "e"].map((x) => kit(`${x.repeat(8)}-0000-4000-8000-000000000000`, `Kit ${x}`)))));
    renderPanel();
    await screen.findByText("Kit a");
    for (const x of ["a", "b"]) await userEvent.click(screen.getByRole("checkbox", { name: `Pick Kit ${x} to compare` }));
    const link = screen.getByTestId("compare-picked");
    expect(link.textContent).toBe("Compare 2 kits");
    expect(link.getAttribute("href")).toMatch(/^\/workspaces\/ws1\/compare\?items=[^,]+,[^,]+$/);
    for (const x of ["c", "d"]) await userEvent.click(screen.getByRole("checkbox", { name: `Pick Kit ${x} to compare` }));
    expect((screen.getByRole("checkbox", { name: "Pick Kit e to compare" }) as HTMLInputElement).disabled).toBe(true);
  });

  it("checks the new-kit form before sending", async () => {
    const fetchMock = stubApi(() => json(200, page([])));
    renderPanel();
    await screen.findByText("No kits yet");
    await userEvent.click(screen.getByTestId("new-kit"));
    await userEvent.click(screen.getByRole("button", { name: "Create kit" }));
    await screen.findByText("Name is required");
    expect(fetchMock.mock.calls.some(([, i]) => i?.method === "POST")).toBe(false);
  });

  it("archives with the version the row showed", async () => {
    const fetchMock = stubApi(() => json(200, page([kit("k1", "Tern front")])));
    renderPanel();
    await userEvent.click(await screen.findByRole("button", { name: "Archive Tern front" }));
    await waitFor(() => expect(fetchMock.mock.calls.some(([, i]) => i?.method === "PATCH")).toBe(true));
    const patch = fetchMock.mock.calls.find(([, i]) => i?.method === "PATCH")!;
    expect(patch[0]).toBe("/api/workspaces/ws1/kits/k1");
    expect(JSON.parse(String(patch[1]!.body))).toEqual({ version: 3, archived: true });
  });

  it("hides the write controls from a viewer", async () => {
    stubApi(() => json(200, page([kit("k1", "Tern front")])));
    renderPanel(false);
    await screen.findByText("Tern front");
    expect(screen.queryByRole("button", { name: /Rename|Archive|Delete/ })).toBeNull();
    expect(screen.queryByTestId("new-kit")).toBeNull();
    expect(screen.getByText(/Ask an admin for the editor role/)).toBeTruthy();
  });
});
