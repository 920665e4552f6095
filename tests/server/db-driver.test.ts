import { describe, expect, it } from "vitest";
import { usesNeonDriver } from "@/server/db/client";

describe("database driver choice", () => {
  it("auto picks the Neon serverless driver for a hosted Neon URL and node-postgres otherwise", () => {
    expect(usesNeonDriver("postgres://u:p@ep-quiet-field-123456.eu-central-1.aws.neon.tech/app?sslmode=require", "auto")).toBe(true);
    expect(usesNeonDriver("postgres://knucklebench@127.0.0.1:54329/knucklebench", "auto")).toBe(false);
    expect(usesNeonDriver("not a url", "auto")).toBe(false);
  });
  it("an explicit DB_DRIVER wins", () => {
    expect(usesNeonDriver("postgres://127.0.0.1/x", "neon")).toBe(true);
    expect(usesNeonDriver("postgres://u@ep-x.neon.tech/x", "pg")).toBe(false);
  });
});
