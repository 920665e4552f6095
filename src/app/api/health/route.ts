// Liveness: the process is up and serves requests. It touches no database, so a database outage never
// makes a load balancer restart healthy instances (readiness is /api/health/ready). The bench uses it as its
// throughput baseline.
export const dynamic = "force-dynamic";

export function GET() {
  return Response.json({ ok: true }, { headers: { "cache-control": "no-store" } });
}
