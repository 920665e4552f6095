// describeError (src/server/http/error-log.ts): what a server error line may say about an error.
import { describe, expect, it } from "vitest";
import { DrizzleQueryError } from "drizzle-orm/errors";
import { describeError } from "@/server/http/error-log";

describe("describeError keeps what finds the bug and drops the user's values", () => {
  it("a Drizzle failed query keeps its parameterised SQL and drops the params line", () => {
    const cause = Object.assign(new Error('invalid input syntax for type uuid: "not-a-uuid"'), { code: "22P02" });
    const error = new DrizzleQueryError('select "id" from "kits" where "kits"."id" = $1 and "name" = $2', ["not-a-uuid", "Ilse's front kit"], cause);
    const line = describeError(error);
    expect(line.split("\n")[0]).toBe(
      'Error: Failed query: select "id" from "kits" where "kits"."id" = $1 and "name" = $2 ← caused by Error [22P02]: invalid input syntax for type uuid: "…"',
    );
    expect(line).not.toContain("params");
    expect(line).not.toContain("not-a-uuid");
    expect(line).not.toContain("Ilse");
  });

  it("double- and single-quoted values in a message are blanked, escapes included", () => {
    const line = describeError(new TypeError(`Key (email)=('ana@test.example') exists; name "Ana \\"Bo\\" Lund" too`));
    expect(line.split("\n")[0]).toBe(`TypeError: Key (email)=('…') exists; name "…" too`);
  });

  it("a thrown non-Error says only its type; a message is cut at 400 characters; stack frames follow", () => {
    expect(describeError("secret@test.example")).toBe("thrown string");
    const long = describeError(new Error("x".repeat(1000)));
    expect(long.split("\n")[0]).toBe(`Error: ${"x".repeat(400)}`);
    expect(long.split("\n")[1]).toMatch(/^ {4}at /);
  });
});
