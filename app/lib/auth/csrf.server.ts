// Cross-site request forgery: every state-changing request must come from our own origin.
// Browsers send Origin on POST (and Sec-Fetch-Site); a request with neither and a session cookie
// is refused. Bearer-token API calls carry no ambient credentials and are exempt — but only when
// no session cookie rides along (a cookie is what a forged cross-site request would bring) — as is
// the Stripe webhook, which is verified by its signature instead.
// Run twice, the same function both times: by app/serve.mjs before React Router (whose own origin check on
// document and `.data` POSTs would otherwise answer a foreign Origin first, 400 with two stacks in the log),
// and by the root middleware (the dev server, and any request that reaches the app another way).
import { settings } from "../shared/env.server";

const SAFE = new Set(["GET", "HEAD", "OPTIONS"]);
const EXEMPT_PATHS = ["/api/stripe/webhook"];
// The public calculators (/api/v1/calc/<name>) read no cookies and change nothing: anonymous
// callers are rate-limited per address, token callers send Authorization. No Origin needed.
const EXEMPT_PATTERNS = [/^\/api\/v1\/calc\/[a-z-]+\/?$/];

/** What the check reads of a request: a Request, or app/serve.mjs's view of one (it runs this check before React Router). */
export type RequestLike = { method: string; url: string; headers: { get(name: string): string | null } };

export function csrfRefusal(request: RequestLike): string | null {
  if (SAFE.has(request.method.toUpperCase())) return null;
  const url = new URL(request.url);
  if (EXEMPT_PATHS.includes(url.pathname) || EXEMPT_PATTERNS.some((re) => re.test(url.pathname))) return null;
  const authz = request.headers.get("authorization") ?? "";
  const hasSessionCookie = /(?:^|;)\s*dm_session=[^;\s]/.test(request.headers.get("cookie") ?? "");
  if (/^bearer\s+/i.test(authz) && !hasSessionCookie) return null;
  const allowed = new Set([url.origin]);
  const appUrl = settings().appUrl;
  if (appUrl) allowed.add(new URL(appUrl).origin);
  const origin = request.headers.get("origin");
  if (origin) return allowed.has(origin) ? null : `Cross-site request refused (origin ${origin}).`;
  const site = request.headers.get("sec-fetch-site");
  if (site) return site === "same-origin" || site === "none" ? null : `Cross-site request refused (${site}).`;
  return "Request refused: it carries no Origin header, so it cannot be shown to come from this site.";
}
