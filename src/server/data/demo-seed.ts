import "server-only";
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import type { WorkspaceRole } from "@/contracts/roles";
import { auth } from "../auth/auth";
import { db } from "../db/client";
import { kits, members, users, workspaces } from "../db/schema";
import { demoKits } from "./demo-kits";

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
  if (found) return { id: found.id, isNew: false };
  const res = await auth.api.signUpEmail({ body: { name: person.name, email: person.email, password: DEMO_PASSWORD } });
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

  let created = 0;
  const author = ids[0]!.id;
  // Newest first in the list, so insert the baseline last.
  for (const kit of [...demoKits()].reverse()) {
    const [exists] = await db
      .select({ id: kits.id })
      .from(kits)
      .where(and(eq(kits.workspaceId, ws.id), eq(kits.name, kit.name)))
      .limit(1);
    if (exists) continue;
    await db.insert(kits).values({ workspaceId: ws.id, name: kit.name, scale: kit.scale, notes: kit.notes, layout: kit.layout, createdBy: author, updatedBy: author });
    created += 1;
  }
  return { workspaceId: ws.id, created };
}
