// The comments list with the network stubbed: markup in a body or a name is shown as text (no element is
// made from it), the empty and error states, a refused comment's field named, and what a reviewer through
// a share link is offered (a name field; no resolve or delete).
import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { render, screen, waitFor } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { afterEach, describe, expect, it, vi } from "vitest";
import { CommentsPanel } from "@/editor/comments/comments-panel";
import { CommentsProvider, type CommentSource } from "@/editor/comments/comments-context";

const MARKUP = `<script>window.__x=1</script><img src=x onerror="window.__x=2"> & <b>bold</b>`;
const json = (status: number, body: unknown) => new Response(JSON.stringify(body), { status, headers: { "content-type": "application/json" } });

const thread = (over: Record<string, unknown> = {}) => ({
  id: "c1", revision: 2, view: "front", xMm: 10, yMm: 5, parentId: null, body: MARKUP, authorName: "<i>Guest</i>", viaShareLink: true,
  resolvedAt: null, resolvedByName: null, createdAt: "2026-12-01T10:00:00.000Z", canDelete: true,
  replies: [{ id: "c2", revision: 2, view: "front", xMm: 10, yMm: 5, parentId: "c1", body: "line one\nline two", authorName: "Tova Brightwater", viaShareLink: false, resolvedAt: null, resolvedByName: null, createdAt: "2026-12-01T11:00:00.000Z", canDelete: false }],
  ...over,
});

const MEMBER: CommentSource = { key: ["c", "member"], listUrl: "/api/workspaces/w/kits/k/comments", itemUrl: (id) => `/api/workspaces/w/kits/k/comments/${id}`, needsName: false };
const SHARED: CommentSource = { key: ["c", "shared"], listUrl: "/api/share/T/comments", itemUrl: null, needsName: true };

function mount(source: CommentSource, revision = 2) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  return render(
    <QueryClientProvider client={client}>
      <CommentsProvider source={source} revision={revision}>
        <CommentsPanel />
      </CommentsProvider>
    </QueryClientProvider>,
  );
}

afterEach(() => {
  vi.unstubAllGlobals();
});

describe("the comments panel", () => {
  it("shows bodies and names holding markup as text, and no element made from them", async () => {
    vi.stubGlobal("fetch", vi.fn(async () => json(200, { threads: [thread()] })));
    const { container } = mount(MEMBER);
    await screen.findByTestId("comment-thread");
    const bodies = screen.getAllByTestId("comment-body").map((b) => b.textContent);
    expect(bodies).toEqual([MARKUP, "line one\nline two"]);
    expect(screen.getByText("<i>Guest</i>")).toBeTruthy();
    expect(container.querySelector("script, img, b, i")).toBeNull();
    expect((window as unknown as { __x?: number }).__x).toBeUndefined();
    // A member resolves; the author (canDelete) may delete the thread, not the reply written by another.
    expect(screen.getByRole("button", { name: "Resolve" })).toBeTruthy();
    expect(screen.getByRole("button", { name: "Delete comment 1 and its replies" })).toBeTruthy();
    expect(screen.queryByRole("button", { name: /Delete the reply/ })).toBeNull();
  });

  it("shows only the revision shown, with an empty state, and resolved threads on request", async () => {
    vi.stubGlobal("fetch", vi.fn(async () => json(200, { threads: [thread({ revision: 1 }), thread({ id: "c3", resolvedAt: "2026-12-02T10:00:00.000Z", resolvedByName: "Tova Brightwater", replies: [] })] })));
    mount(MEMBER);
    expect((await screen.findByTestId("comments-empty")).textContent).toBe("Every comment here is resolved.");
    await userEvent.click(screen.getByLabelText("Show resolved (1)"));
    expect(screen.getAllByTestId("comment-thread")).toHaveLength(1);
    expect(screen.getByText("Resolved by Tova Brightwater")).toBeTruthy();
    expect(screen.getByRole("button", { name: "Reopen" })).toBeTruthy();
  });

  it("says when the list cannot be loaded", async () => {
    vi.stubGlobal("fetch", vi.fn(async () => json(403, { error: { code: "comments_not_allowed", message: "This share link does not allow comments." } })));
    mount(SHARED);
    expect((await screen.findByRole("alert")).textContent).toContain("This share link does not allow comments.");
  });

  it("through a share link: a name field, no resolve or delete, and a refused reply names the field", async () => {
    const fetchMock = vi.fn(async (_url: string, init?: RequestInit) =>
      init?.method === "POST"
        ? json(422, { error: { code: "invalid", message: "Invalid body: authorName: Name must not contain control characters or line breaks", fields: [{ path: "authorName", message: "Name must not contain control characters or line breaks" }] } })
        : json(200, { threads: [thread()] }),
    );
    vi.stubGlobal("fetch", fetchMock);
    mount(SHARED);
    await screen.findByTestId("comment-thread");
    expect(screen.queryByRole("button", { name: "Resolve" })).toBeNull();
    expect(screen.queryByRole("button", { name: /Delete/ })).toBeNull();
    await userEvent.click(screen.getByRole("button", { name: "Reply" }));
    await userEvent.type(screen.getByLabelText("Your name"), "Guest");
    await userEvent.type(screen.getByPlaceholderText("Write a comment"), "Agreed");
    await userEvent.click(screen.getAllByRole("button", { name: "Reply" }).at(-1)!);
    await waitFor(() => expect(screen.getByRole("alert").textContent).toBe("authorName: Name must not contain control characters or line breaks"));
    const post = fetchMock.mock.calls.find((c) => c[1]?.method === "POST")!;
    expect(JSON.parse(String(post[1]!.body))).toEqual({ body: "Agreed", authorName: "Guest", parentId: "c1" });
  });
});
