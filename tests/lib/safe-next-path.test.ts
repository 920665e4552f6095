import { describe, expect, it } from "vitest";
import { safeNextPath } from "@/contracts/account";
import { roleCan } from "@/contracts/roles";

describe("post-sign-in destination", () => {
  it.each([
    ["/workspaces/abc/kits", "/workspaces/abc/kits"],
    [undefined, "/kits"],
    ["https://elsewhere.example/", "/kits"],
    ["//elsewhere.example", "/kits"],
    ["/\\elsewhere.example", "/kits"],
  ])("%s → %s", (next, expected) => {
    expect(safeNextPath(next)).toBe(expected);
  });
});

describe("the permissions statement", () => {
  it("viewers read kits only; editors write kits; admins manage members; only owners delete the workspace", () => {
    expect(roleCan("viewer", "kit", "read")).toBe(true);
    expect(roleCan("viewer", "kit", "update")).toBe(false);
    expect(roleCan("editor", "kit", "delete")).toBe(true);
    expect(roleCan("editor", "member", "create")).toBe(false);
    expect(roleCan("admin", "member", "create")).toBe(true);
    expect(roleCan("admin", "organization", "delete")).toBe(false);
    expect(roleCan("owner", "organization", "delete")).toBe(true);
    expect(roleCan("viewer,editor", "kit", "create")).toBe(true);
    expect(roleCan("superuser", "kit", "read")).toBe(false);
  });
});
