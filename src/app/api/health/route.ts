// A trivial route: load balancers probe it, and the bench uses it as its throughput baseline.
export const dynamic = "force-dynamic";

export function GET() {
  return Response.json({ ok: true });
}
