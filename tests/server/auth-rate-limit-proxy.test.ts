// With KB_TRUST_PROXY_HOPS=1 (one proxy in front, here the test's own loopback client), the address that
// proxy put in X-Forwarded-For is the one the auth rate limit counts against.
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { randomClientIp, signUp } from "../helpers/api";
import { signInOver, startStampingServer } from "../helpers/stamping-server";

vi.hoisted(() => {
  process.env.KB_TRUST_PROXY_HOPS = "1";
});


let server: Awaited<ReturnType<typeof startStampingServer>>;
beforeAll(async () => {
  server = await startStampingServer();
});
afterAll(() => server.close());

describe("auth rate limit behind a trusted proxy", () => {
  it("honours the forwarded address: distinct clients get their own allowance", async () => {
    const person = await signUp("Rook Ferrand");
    const statuses: number[] = [];
    for (let i = 0; i < 15; i++) {
      statuses.push((await signInOver(server.url, person.email, "wrong-password-1", { "x-forwarded-for": randomClientIp() })).status);
    }
    expect(statuses).toEqual(Array(15).fill(401));
    const right = await signInOver(server.url, person.email, person.password, { "x-forwarded-for": randomClientIp() });
    expect(right.status).toBe(200);
  });

  it("still limits one forwarded client, and trusts only one hop of the chain", async () => {
    const person = await signUp("Tamsin Oyelaran");
    const client = randomClientIp();
    const statuses: number[] = [];
    for (let i = 0; i < 12; i++) {
      // The client prepends made-up entries; the proxy (one hop) appended the real one last.
      const forged = `${randomClientIp()}, ${client}`;
      statuses.push((await signInOver(server.url, person.email, "wrong-password-1", { "x-forwarded-for": forged })).status);
    }
    expect(statuses.slice(0, 10)).toEqual(Array(10).fill(401));
    expect(statuses.slice(10)).toEqual([429, 429]);
  });
});
