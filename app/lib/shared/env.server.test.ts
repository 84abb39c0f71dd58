// Settings read from the environment (app/lib/shared/env.server.ts): defaults, normalisation, and a
// clear line per bad value. Expected values are the documented defaults in that file (our own).
import { describe, expect, test } from "vitest";
import { DEFAULT_MAIL_FROM, SettingsError, assertSettings, settings, settingsProblems } from "./env.server";

describe("settings", () => {
  test("an empty environment gives the documented defaults", () => {
    const s = settings({});
    expect(s).toMatchObject({ port: 3000, host: "127.0.0.1", appUrl: null, cookieSecure: false, trustProxy: false, accessLog: true, smtpUrl: null, mailFrom: DEFAULT_MAIL_FROM, mailFlushIntervalMs: null, production: false });
    expect(s.stripe).toEqual({ secretKey: "", webhookSecret: "", priceId: null, honouredPriceIds: [], apiBase: null });
  });

  test("values are trimmed, trailing slashes dropped, empty strings count as unset", () => {
    const s = settings({ APP_URL: " https://pumps.example/ ", MAILBOX_API_URL: "http://127.0.0.1:9/", PORT: "", HOST: "0.0.0.0", STRIPE_API_BASE: "" });
    expect(s.appUrl).toBe("https://pumps.example");
    expect(s.mailboxApiUrl).toBe("http://127.0.0.1:9");
    expect(s.port).toBe(3000);
    expect(s.host).toBe("0.0.0.0");
    expect(s.stripe.apiBase).toBeNull();
  });

  test("the Secure cookie flag follows APP_URL unless COOKIE_SECURE says otherwise", () => {
    expect(settings({ APP_URL: "https://pumps.example" }).cookieSecure).toBe(true);
    expect(settings({ APP_URL: "http://pumps.example" }).cookieSecure).toBe(false);
    expect(settings({ APP_URL: "https://pumps.example", COOKIE_SECURE: "0" }).cookieSecure).toBe(false);
    expect(settings({ APP_URL: "http://pumps.example", COOKIE_SECURE: "1" }).cookieSecure).toBe(true);
  });

  test("STRIPE_PRICE_IDS_HONOURED: older plan prices, comma-separated, spaces and empty entries dropped — our setting", () => {
    expect(settings({ STRIPE_PRICE_IDS_HONOURED: " price_network_2025, price_network_2024 ,," }).stripe.honouredPriceIds).toEqual(["price_network_2025", "price_network_2024"]);
  });

  test("a cluster DATABASE_URL (several hosts) is accepted", () => {
    expect(settingsProblems({ DATABASE_URL: "mariadb://u:p@127.0.0.1:3307,127.0.0.1:3308/dutymark" })).toEqual([]);
  });

  test("TRUST_PROXY: none, a number of proxy hops, or the proxies' addresses and subnets — never every entry (our setting)", () => {
    expect(settings({}).proxyTrust).toBe(false);
    expect(settings({ TRUST_PROXY: "0" })).toMatchObject({ trustProxy: false, proxyTrust: false });
    expect(settings({ TRUST_PROXY: "1" })).toMatchObject({ trustProxy: true, proxyTrust: 1 }); // one proxy: was `true`, every hop trusted
    expect(settings({ TRUST_PROXY: "2" }).proxyTrust).toBe(2);
    expect(settings({ TRUST_PROXY: " loopback, 10.0.0.0/8 ,fd00::/8, 192.0.2.10 " })).toMatchObject({ trustProxy: true, proxyTrust: ["loopback", "10.0.0.0/8", "fd00::/8", "192.0.2.10"] });
  });

  test("unknown variables are ignored", () => {
    expect(settingsProblems({ SOMETHING_ELSE: "x", PATH: "/usr/bin" })).toEqual([]);
  });
});

describe("bad values are named, one line each", () => {
  const cases: [string, string, RegExp][] = [
    ["APP_URL", "ftp://pumps.example", /^APP_URL must be a URL starting with http:\/\/ or https:\/\//],
    ["APP_URL", "not a url", /^APP_URL must be a URL/],
    ["PORT", "70000", /^PORT must be at most 65535/],
    ["PORT", "0", /^PORT must be at least 1/],
    ["PORT", "3e3", /^PORT must be a whole number/],
    ["PORT", "-1", /^PORT must be a whole number/],
    ["TRUST_PROXY", "yes", /^TRUST_PROXY must be 0, a number of proxy hops from 1 to 10, or your proxies' addresses or subnets/],
    ["TRUST_PROXY", "true", /^TRUST_PROXY must be 0, a number of proxy hops/], // Express's "trust every entry", the forgeable setting
    ["TRUST_PROXY", "11", /^TRUST_PROXY must be 0, a number of proxy hops from 1 to 10/],
    ["TRUST_PROXY", "10.0.0.0/33", /^TRUST_PROXY must be 0, a number of proxy hops/], // an IPv4 prefix is at most 32 bits
    ["TRUST_PROXY", "10.0.0.5, proxy.internal", /^TRUST_PROXY must be 0, a number of proxy hops/], // names are not looked up
    ["NODE_ENV", "staging", /^NODE_ENV must be development, production or test/],
    ["DATABASE_URL", "postgres://u@h/db", /^DATABASE_URL must look like mariadb:\/\//],
    ["DATABASE_URL", "mariadb://u@h:notaport/db", /^DATABASE_URL must look like/],
    ["SMTP_URL", "http://mail.example", /^SMTP_URL must be a URL starting with smtp:\/\/ or smtps:\/\//],
    ["MAIL_FLUSH_INTERVAL_MS", "NaN", /^MAIL_FLUSH_INTERVAL_MS must be a whole number/],
    ["STRIPE_SECRET_KEY", "pk_live_123", /^STRIPE_SECRET_KEY must start with sk_ or rk_/],
    ["STRIPE_WEBHOOK_SECRET", "secret", /^STRIPE_WEBHOOK_SECRET must start with whsec_/],
    ["STRIPE_PRICE_IDS_HONOURED", "price_a, prod_b", /^STRIPE_PRICE_IDS_HONOURED must be price ids \(price_…\) separated by commas/],
  ];
  test.each(cases)("%s=%s", (key, value, message) => {
    const problems = settingsProblems({ [key]: value });
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatch(message);
    expect(problems[0]).toContain(JSON.stringify(value));
    expect(() => settings({ [key]: value })).toThrow(SettingsError);
  });

  test("every problem is listed at once, and a good environment passes", () => {
    let err: unknown;
    try {
      assertSettings({ APP_URL: "ftp://x", PORT: "99999", TRUST_PROXY: "true" });
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(SettingsError);
    expect((err as SettingsError).problems).toHaveLength(3);
    expect((err as Error).message).toMatch(/^Dutymark cannot start: 3 settings are wrong:\n {2}- APP_URL/);
    expect(assertSettings({ APP_URL: "http://127.0.0.1:3000", PORT: "3000" }).port).toBe(3000);
  });
});
