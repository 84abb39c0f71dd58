// Demo data, idempotent: running it twice changes nothing. All names are invented.
// Run by `npm start` (not by `npm test`, whose database starts empty apart from what tests add).
import path from "node:path";
import { fileURLToPath } from "node:url";
import { eq } from "drizzle-orm";
import { hash } from "@node-rs/argon2";
import { closeDb, db, withTransaction } from "./client.server";
import { memberships, users, workspaces, type Role } from "./schema";

export const DEMO_PASSWORD = "duty-demo-2026";

export const DEMO_WORKSPACES = [
  { name: "Kestrel Building Services", slug: "kestrel", plan: "free" as const },
  { name: "Harrow & Vell Pumps", slug: "harrow-vell", plan: "network" as const },
  { name: "Lowmoor Commissioning", slug: "lowmoor", plan: "free" as const },
];

export const DEMO_USERS: { email: string; name: string; workspace: string; role: Role }[] = [
  { email: "admin@kestrel.example", name: "Ada Kestrel", workspace: "kestrel", role: "admin" },
  { email: "engineer@kestrel.example", name: "Ravi Patel", workspace: "kestrel", role: "engineer" },
  { email: "distributor@harrow-vell.example", name: "Mina Vell", workspace: "harrow-vell", role: "distributor" },
  { email: "contractor@lowmoor.example", name: "Tom Lowmoor", workspace: "lowmoor", role: "contractor" },
  { email: "viewer@kestrel.example", name: "Iris Moss", workspace: "kestrel", role: "viewer" },
];

export async function seed(): Promise<{ created: number }> {
  let created = 0;
  const passwordHash = await hash(DEMO_PASSWORD);
  await withTransaction(async (tx) => {
    for (const w of DEMO_WORKSPACES) {
      const found = await tx.select({ id: workspaces.id }).from(workspaces).where(eq(workspaces.slug, w.slug));
      if (found.length === 0) {
        await tx.insert(workspaces).values(w);
        created++;
      }
    }
    for (const u of DEMO_USERS) {
      const found = await tx.select({ id: users.id }).from(users).where(eq(users.email, u.email));
      let userId = found[0]?.id;
      if (!userId) {
        userId = `demo-${u.email.split("@")[0]}-${u.workspace}`;
        const [w] = await tx.select({ id: workspaces.id }).from(workspaces).where(eq(workspaces.slug, u.workspace));
        await tx
          .insert(users)
          .values({ id: userId, email: u.email, name: u.name, passwordHash, emailVerified: true, currentWorkspaceId: w.id });
        created++;
      }
      const [ws] = await tx.select({ id: workspaces.id }).from(workspaces).where(eq(workspaces.slug, u.workspace));
      const m = await tx
        .select({ id: memberships.id })
        .from(memberships)
        .where(eq(memberships.userId, userId));
      if (!m.some(() => true)) {
        await tx.insert(memberships).values({ workspaceId: ws.id, userId, role: u.role });
        created++;
      }
    }
  });
  return { created };
}

if (process.argv[1] && fileURLToPath(import.meta.url) === path.resolve(process.argv[1])) {
  seed()
    .then(async ({ created }) => {
      process.stderr.write(`[db] demo data: ${created ? `${created} rows created` : "already present"}\n`);
      await closeDb();
    })
    .catch(async (err) => {
      process.stderr.write(`[db] seed failed: ${err?.stack ?? err}\n`);
      await closeDb().catch(() => {});
      process.exit(1);
    });
}
