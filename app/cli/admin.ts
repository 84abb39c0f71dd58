// Operator commands: `npm run admin -- <command> [--flag value …]` (same configuration as npm start).
//   create-user  --email E --password P --workspace NAME --role ROLE [--name N]
//   create-token --email E --workspace NAME [--scope read|write] [--name N]   (prints the token alone on its last line)
import { and, eq } from "drizzle-orm";
import { closeDb, db, withTransaction } from "../../db/client.server";
import { memberships, users, workspaces } from "../../db/schema";
import { hashPassword, normaliseEmail } from "../lib/auth/session.server";
import { newUserId } from "../lib/auth/accounts.server";
import { createApiToken } from "../lib/auth/api-tokens.server";
import { slugify } from "../lib/workspaces";
import { isRole } from "../lib/auth/permissions";

function flags(argv: string[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a.startsWith("--")) {
      const [k, inline] = a.slice(2).split("=", 2);
      out[k] = inline ?? argv[++i] ?? "";
    }
  }
  return out;
}

function need(f: Record<string, string>, k: string): string {
  if (!f[k]) throw new Error(`missing --${k}`);
  return f[k];
}

async function findWorkspace(name: string) {
  const [ws] = await db().select().from(workspaces).where(eq(workspaces.name, name));
  return ws ?? null;
}

async function createUser(f: Record<string, string>) {
  const email = normaliseEmail(need(f, "email"));
  const password = need(f, "password");
  if (password.length < 10) throw new Error("--password must have at least 10 characters");
  const wsName = need(f, "workspace");
  const role = need(f, "role");
  if (!isRole(role)) throw new Error(`--role must be one of admin, engineer, distributor, contractor, viewer`);
  const passwordHash = await hashPassword(password);
  const out = await withTransaction(async (tx) => {
    let [ws] = await tx.select().from(workspaces).where(eq(workspaces.name, wsName));
    let wsCreated = false;
    if (!ws) {
      let slug = slugify(wsName);
      if ((await tx.select().from(workspaces).where(eq(workspaces.slug, slug))).length) slug = `${slug}-${Date.now().toString(36)}`;
      const [{ id }] = await tx.insert(workspaces).values({ name: wsName, slug }).$returningId();
      [ws] = await tx.select().from(workspaces).where(eq(workspaces.id, id));
      wsCreated = true;
    }
    let [u] = await tx.select().from(users).where(eq(users.email, email));
    if (!u) {
      const id = newUserId();
      await tx.insert(users).values({ id, email, name: f.name ?? email.split("@")[0], passwordHash, emailVerified: true, currentWorkspaceId: ws.id });
      [u] = await tx.select().from(users).where(eq(users.id, id));
    } else {
      await tx.update(users).set({ passwordHash, emailVerified: true }).where(eq(users.id, u.id));
    }
    const [m] = await tx.select().from(memberships).where(and(eq(memberships.userId, u.id), eq(memberships.workspaceId, ws.id)));
    if (m) await tx.update(memberships).set({ role }).where(eq(memberships.id, m.id));
    else await tx.insert(memberships).values({ userId: u.id, workspaceId: ws.id, role });
    return { userId: u.id, workspaceId: ws.id, wsCreated };
  });
  console.log(`user ${email} is ${role} in "${wsName}"${out.wsCreated ? " (workspace created)" : ""}; address marked verified`);
}

async function createToken(f: Record<string, string>) {
  const email = normaliseEmail(need(f, "email"));
  const ws = await findWorkspace(need(f, "workspace"));
  if (!ws) throw new Error(`no workspace named "${f.workspace}"`);
  const scope = (f.scope ?? "read") as "read" | "write";
  if (scope !== "read" && scope !== "write") throw new Error("--scope must be read or write");
  const [u] = await db().select().from(users).where(eq(users.email, email));
  if (!u) throw new Error(`no user ${email}`);
  const [m] = await db().select().from(memberships).where(and(eq(memberships.userId, u.id), eq(memberships.workspaceId, ws.id)));
  if (!m) throw new Error(`${email} is not a member of "${ws.name}"`);
  const { token } = await createApiToken({ userId: u.id, workspaceId: ws.id, name: f.name ?? "admin command", scope });
  console.log(`token for ${email} in "${ws.name}", scope ${scope} (shown once):`);
  console.log(token);
}

const [command, ...rest] = process.argv.slice(2);
const f = flags(rest);
const commands: Record<string, (f: Record<string, string>) => Promise<void>> = { "create-user": createUser, "create-token": createToken };
const run = commands[command ?? ""];
if (!run) {
  console.error("usage: npm run admin -- create-user --email E --password P --workspace NAME --role ROLE\n       npm run admin -- create-token --email E --workspace NAME [--scope read|write]");
  process.exit(2);
}
run(f)
  .then(() => closeDb())
  .catch(async (e) => {
    console.error(`admin: ${e.message}`);
    await closeDb().catch(() => {});
    process.exit(1);
  });
