import { pingDatabase } from "@/server/db/client";
import { DATA_STORE_RETRY_AFTER_S, DATA_STORE_UNAVAILABLE_CODE } from "@/contracts/data-store";

// Readiness: whether this instance can serve data now, i.e. the database answers within a short time. A
// load balancer takes an instance out of rotation on 503 and back on 200; nothing here needs a session.
export const dynamic = "force-dynamic";

/** Under a load balancer's usual probe timeout (2–5 s), so a slow database reads as not ready, not as a hung probe. */
const PROBE_TIMEOUT_MS = 2_000;

export async function GET() {
  const ping = await pingDatabase(PROBE_TIMEOUT_MS);
  if (ping.ok) {
    return Response.json({ ok: true, database: { ok: true, ms: ping.ms } }, { headers: { "cache-control": "no-store" } });
  }
  return Response.json(
    {
      ok: false,
      database: { ok: false, reason: ping.reason },
      error: { code: DATA_STORE_UNAVAILABLE_CODE, message: "The data store does not answer; this instance cannot serve data now." },
    },
    { status: 503, headers: { "cache-control": "no-store", "retry-after": String(DATA_STORE_RETRY_AFTER_S) } },
  );
}
