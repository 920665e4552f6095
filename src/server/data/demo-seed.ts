import "server-only";
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import type { WorkspaceRole } from "@/contracts/roles";
import { auth } from "../auth/auth";
import { db } from "../db/client";
import { applyShelfItem, type ShelfItem } from "@/contracts/shelf";
import { kitRevisions, kits, members, shelfItems, users, workspaces } from "../db/schema";
import { DEMO_KITS, DEMO_SHELF, DEMO_TARGETS, type DemoKit } from "./demo-kits";
import { createKit, saveKitLayout, updateKit } from "./kits";
import { createVariant } from "./revisions";
import { seedDemoTestLog, seedDemoUnderlay } from "./demo-test-log";
import { listShelf } from "./shelf";
import { getTargets, putTargets } from "./targets";

// An invented club and its people. Nothing here describes a real team or product.
export const DEMO_WORKSPACE = { name: "Harrow Flats RC Works", slug: "harrow-flats" };
export const DEMO_PASSWORD = "bench-demo-2026";
export const DEMO_PEOPLE: { name: string; email: string; role: WorkspaceRole }[] = [
  { name: "Ines Okafor", email: "ines@harrowflats.example", role: "owner" },
  { name: "Tomas Reyes", email: "tomas@harrowflats.example", role: "editor" },
  { name: "Priya Lund", email: "priya@harrowflats.example", role: "viewer" },
];

async function ensureUser(person: { name: string; email: string }): Promise<{ id: string; isNew: boolean }> {
  const [found] = await db.select({ id: users.id }).from(users).where(eq(users.email, person.email)).limit(1);
  if (found) {
    await db.update(users).set({ emailVerified: true }).where(eq(users.id, found.id));
    return { id: found.id, isNew: false };
  }
  // Called without a request, sign-up sends no confirmation message (src/server/auth/auth.ts): the demo's
  // invented addresses are confirmed here, so signing in as printed works at once.
  const res = await auth.api.signUpEmail({ body: { name: person.name, email: person.email, password: DEMO_PASSWORD } });
  await db.update(users).set({ emailVerified: true }).where(eq(users.id, res.user.id));
  return { id: res.user.id, isNew: true };
}

// The demo people share one workspace; the personal one sign-up gave them would only distract.
async function dropPersonalWorkspaces(userId: string, keep: string) {
  const owned = await db.select({ id: members.organizationId }).from(members).where(and(eq(members.userId, userId), eq(members.role, "owner")));
  for (const { id } of owned) {
    if (id === keep) continue;
    const [anyKit] = await db.select({ id: kits.id }).from(kits).where(eq(kits.workspaceId, id)).limit(1);
    if (!anyKit) await db.delete(workspaces).where(eq(workspaces.id, id));
  }
}

/** The club's own shelf items beside the catalogue's (added once, by name); answers every item by demo key. */
async function seedShelf(workspaceId: string, author: string): Promise<Map<string, ShelfItem>> {
  const byKey = new Map<string, ShelfItem>();
  let items = await listShelf(workspaceId);
  for (const d of DEMO_SHELF) {
    let item = items.find((i) => i.kind === d.kind && i.name === d.name);
    if (!item) {
      const spec = d.kind === "shaft" ? { ...d.spec, materialKey: undefined, materialId: d.spec.materialKey ? byKey.get(d.spec.materialKey)!.id : null } : d.spec;
      delete (spec as { materialKey?: unknown }).materialKey;
      await db.insert(shelfItems).values({ workspaceId, kind: d.kind, name: d.name, spec, createdBy: author, updatedBy: author }).onConflictDoNothing();
      items = await listShelf(workspaceId);
      item = items.find((i) => i.kind === d.kind && i.name === d.name)!;
    }
    byKey.set(d.key, item);
  }
  return byKey;
}

/** The club's targets, set once over the starting ones (a workspace that changed them keeps its own). */
async function seedTargets(workspaceId: string, author: string): Promise<void> {
  const t = await getTargets(workspaceId);
  if (t.version === 1) await putTargets(workspaceId, author, 1, DEMO_TARGETS);
}

const DAY_MS = 86_400_000;

/** One demo kit with its revisions (each by its author, with its note, dated as the story has it). */
async function seedKit(workspaceId: string, kit: DemoKit, authors: Record<"owner" | "editor", string>, shelf: Map<string, ShelfItem>, made: Map<string, string>): Promise<string> {
  const materials = [...shelf.values()].filter((i) => i.kind === "material");
  const layoutOf = (r: DemoKit["revisions"][number]) => (r.shelf ?? []).reduce((l, key) => applyShelfItem(l, shelf.get(key)!, materials), r.layout);
  const fields = { name: kit.name, scale: kit.scale as "1:10", notes: kit.notes, tags: [...kit.tags] };
  const origin = kit.from ? made.get(kit.from.key) : undefined;
  const first = kit.revisions[0]!;
  // A variant starts as a copy of its origin's revision (revision 1), and its own work follows.
  const created = origin
    ? await createVariant(workspaceId, origin, authors[first.by], { ...fields, revision: kit.from!.revision })
    : await createKit(workspaceId, authors[first.by], fields, layoutOf(first), { kind: "create", note: first.note });
  const saves = origin ? kit.revisions : kit.revisions.slice(1);
  let version = created.version;
  for (const r of saves) version = (await saveKitLayout(workspaceId, created.id, authors[r.by], version, layoutOf(r), { kind: "save", note: r.note })).version;
  if (kit.targets || kit.archived) await updateKit(workspaceId, created.id, authors.owner, version, { ...(kit.targets ? { targets: kit.targets } : {}), ...(kit.archived ? { archived: true } : {}) });
  // Dated as the story has it, so the history and the library read like a season's work.
  const now = Date.now();
  const dates = [...(origin ? [first.daysAgo + 0.2] : []), ...kit.revisions.map((r) => r.daysAgo)].map((d) => new Date(now - d * DAY_MS));
  for (const [i, at] of dates.entries()) {
    await db.update(kitRevisions).set({ createdAt: at }).where(and(eq(kitRevisions.kitId, created.id), eq(kitRevisions.number, i + 1)));
  }
  const last = dates[dates.length - 1]!;
  await db.update(kits).set({ createdAt: dates[0]!, updatedAt: last, ...(kit.archived ? { archivedAt: last } : {}) }).where(eq(kits.id, created.id));
  return created.id;
}

/** Creates the demo workspace, people and kits when missing; leaves existing data alone. */
export async function seedDemo(): Promise<{ workspaceId: string; created: number }> {
  const ids = [];
  for (const person of DEMO_PEOPLE) ids.push({ ...person, ...(await ensureUser(person)) });

  let [ws] = await db.select({ id: workspaces.id }).from(workspaces).where(eq(workspaces.slug, DEMO_WORKSPACE.slug)).limit(1);
  if (!ws) {
    ws = { id: randomUUID() };
    await db.insert(workspaces).values({ id: ws.id, name: DEMO_WORKSPACE.name, slug: DEMO_WORKSPACE.slug });
  }
  for (const person of ids) {
    await db
      .insert(members)
      .values({ id: randomUUID(), organizationId: ws.id, userId: person.id, role: person.role })
      .onConflictDoNothing();
  }

  for (const person of ids) if (person.isNew) await dropPersonalWorkspaces(person.id, ws.id);

  const authors = { owner: ids.find((p) => p.role === "owner")!.id, editor: ids.find((p) => p.role === "editor")!.id };
  const shelf = await seedShelf(ws.id, authors.owner);
  await seedTargets(ws.id, authors.owner);
  let created = 0;
  const made = new Map<string, string>();
  for (const kit of DEMO_KITS) {
    const [exists] = await db.select({ id: kits.id }).from(kits).where(and(eq(kits.workspaceId, ws.id), eq(kits.name, kit.name))).limit(1);
    if (exists) {
      made.set(kit.key, exists.id);
      continue;
    }
    made.set(kit.key, await seedKit(ws.id, kit, authors, shelf, made));
    created += 1;
  }
  // The test log (runs with photos) and a drawing under the baseline's front view: files in object storage.
  await seedDemoTestLog(ws.id, authors);
  await seedDemoUnderlay(ws.id, authors.owner);
  return { workspaceId: ws.id, created };
}
