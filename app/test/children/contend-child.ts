// Child process for app/test/cluster.test.ts: hammers one shared row from its own cluster node, so
// two of these on two Galera nodes produce certification conflicts. Waits until START_AT (epoch ms)
// so both start together, then prints one JSON line. Run with DATABASE_URL and MODE:
//   MODE=ratelimit BUCKET=… HITS=n  → {"hits":[…]}  (the count each hit saw)
//   MODE=outbox                     → {"sent":n,"failed":n,"due":n}  (SMTP_URL: where to deliver)
import { closeDb } from "@db/client.server";
import { hitRateLimit } from "~/lib/shared/ratelimit.server";
import { flushOutbox } from "~/lib/mail/outbox.server";

const startAt = Number(process.env.START_AT ?? 0);
await new Promise((r) => setTimeout(r, Math.max(0, startAt - Date.now())));
try {
  if (process.env.MODE === "ratelimit") {
    const rule = { limit: 1_000_000, windowSeconds: 3600 };
    const n = Number(process.env.HITS ?? 20);
    // Fired in small concurrent waves: several statements in flight on each node at once.
    const hits: number[] = [];
    for (let i = 0; i < n; i += 4) {
      const wave = await Promise.all(Array.from({ length: Math.min(4, n - i) }, () => hitRateLimit(process.env.BUCKET!, rule)));
      hits.push(...wave.map((w) => w.hits));
    }
    process.stdout.write(`${JSON.stringify({ hits })}\n`);
  } else if (process.env.MODE === "outbox") {
    const out = await flushOutbox({ limit: 500 });
    process.stdout.write(`${JSON.stringify(out)}\n`);
  } else {
    throw new Error(`unknown MODE ${process.env.MODE}`);
  }
} catch (e) {
  process.stdout.write(`${JSON.stringify({ error: (e as Error).message })}\n`);
}
await closeDb();
process.exit(0);
