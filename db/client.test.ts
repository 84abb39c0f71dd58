// Integration tests against the real MariaDB at DATABASE_URL (npm test points it at the test database).
import { afterAll, describe, expect, test } from "vitest";
import { eq, like } from "drizzle-orm";
import { closeDb, db, dbAlive, withTransaction } from "./client.server";
import { workspaces } from "./schema";

const tag = `txprobe-${Date.now()}`;

afterAll(async () => {
  await db().delete(workspaces).where(like(workspaces.slug, `${tag}%`));
  await closeDb();
});

describe("database client", () => {
  test("answers and returns numbers as numbers", async () => {
    expect(await dbAlive()).toBe(true);
    await db().insert(workspaces).values({ name: "Probe", slug: `${tag}-num` });
    const [row] = await db().select().from(workspaces).where(eq(workspaces.slug, `${tag}-num`));
    expect(typeof row.id).toBe("number");
    expect(row.createdAt).toBeInstanceOf(Date);
  });

  test("a transaction that throws leaves nothing written", async () => {
    await expect(
      withTransaction(async (tx) => {
        await tx.insert(workspaces).values({ name: "A", slug: `${tag}-a` });
        await tx.insert(workspaces).values({ name: "B", slug: `${tag}-b` });
        // Visible inside the transaction…
        const inside = await tx.select().from(workspaces).where(like(workspaces.slug, `${tag}-_`));
        expect(inside).toHaveLength(2);
        throw new Error("boom");
      }),
    ).rejects.toThrow("boom");
    // …and gone after the rollback.
    const after = await db().select().from(workspaces).where(like(workspaces.slug, `${tag}-_`));
    expect(after).toHaveLength(0);
  });

  test("a failing statement rolls back the earlier ones", async () => {
    await expect(
      withTransaction(async (tx) => {
        await tx.insert(workspaces).values({ name: "C", slug: `${tag}-c` });
        await tx.insert(workspaces).values({ name: "dup", slug: `${tag}-c` }); // unique slug → error
      }),
    ).rejects.toThrow();
    const after = await db().select().from(workspaces).where(eq(workspaces.slug, `${tag}-c`));
    expect(after).toHaveLength(0);
  });

  test("a transaction that resolves commits every row", async () => {
    const n = await withTransaction(async (tx) => {
      await tx.insert(workspaces).values([
        { name: "D", slug: `${tag}-d` },
        { name: "E", slug: `${tag}-e` },
      ]);
      return 2;
    });
    const after = await db().select().from(workspaces).where(like(workspaces.slug, `${tag}-_`));
    expect(after).toHaveLength(n);
  });
});
