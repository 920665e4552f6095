// The auth rate limit counts attempts against the connection's address, not a header anyone can write.
// Requests go over a real loopback socket through the same stamping scripts/serve.mjs does.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { randomClientIp, signUp } from "../helpers/api";
import { signInOver, startStampingServer } from "../helpers/stamping-server";

let server: Awaited<ReturnType<typeof startStampingServer>>;
beforeAll(async () => {
  server = await startStampingServer();
});
afterAll(() => server.close());

describe("auth rate limit, no proxy trusted (the default)", () => {
  it("locks out a flood from one address however X-Forwarded-For varies, the right password included", async () => {
    const victim = await signUp("Odile Brack");
    const statuses: number[] = [];
    for (let i = 0; i < 15; i++) {
      const res = await signInOver(server.url, victim.email, "wrong-password-1", { "x-forwarded-for": randomClientIp() });
      statuses.push(res.status);
    }
    // 10 a minute per address (src/server/auth/auth.ts): the first ten are plain refusals, the rest 429.
    expect(statuses.slice(0, 10)).toEqual(Array(10).fill(401));
    expect(statuses.slice(10)).toEqual(Array(5).fill(429));
    const right = await signInOver(server.url, victim.email, victim.password, { "x-forwarded-for": randomClientIp() });
    expect(right.status).toBe(429);
    // The standard header (the auth route turns better-auth's X-Retry-After into it), and a message saying when.
    expect(Number(right.headers.get("retry-after"))).toBeGreaterThan(0);
    expect(((await right.json()) as { error: { message: string } }).error.message).toMatch(/^Too many sign-in attempts in a short time. Try again in \d+ seconds.$/);
  });

  it("ignores a client's own copy of the peer-address header", async () => {
    const victim = await signUp("Pell Aster");
    const statuses: number[] = [];
    // The loopback bucket is spent by the test above; forging the stamp must not open a fresh one.
    for (let i = 0; i < 3; i++) {
      const res = await signInOver(server.url, victim.email, victim.password, { "x-kb-socket-address": randomClientIp(), "x-kb-client-address": randomClientIp() });
      statuses.push(res.status);
    }
    expect(statuses).toEqual([429, 429, 429]);
  });
});
