// The e-mail texts: escaping, one-line subjects, safe links, and the facts each one must carry.
import { describe, expect, test } from "vitest";
import {
  ROLE_PHRASES,
  checkedLink,
  escapeHtml,
  fieldCheckMail,
  oneLine,
  passwordResetMail,
  verifyAddressMail,
  workspaceInviteMail,
} from "./templates";

const LINK = "https://dutymark.localhost/verify?token=abc&next=%2Fprojects";
const HOSTILE = `<script>alert("x")</script> & 'Co'`;

describe("escapeHtml", () => {
  // The five characters with meaning in HTML text and quoted attributes (common practice, as in
  // the OWASP XSS prevention cheat sheet's output-encoding rule for HTML contexts).
  test("encodes & < > \" '", () => {
    expect(escapeHtml(`a & b < c > d " e ' f`)).toBe("a &amp; b &lt; c &gt; d &quot; e &#39; f");
  });
  test("encodes & first, so entities are not double-decoded", () => {
    expect(escapeHtml("&lt;")).toBe("&amp;lt;");
  });
});

describe("helpers", () => {
  test("oneLine flattens line breaks (no header injection) and shortens", () => {
    expect(oneLine("Acme\r\nBcc: x@example.test")).toBe("Acme Bcc: x@example.test");
    expect(oneLine("abcdef", 4)).toBe("abc…");
  });
  test("checkedLink allows http(s) only", () => {
    expect(checkedLink(LINK)).toBe(LINK);
    expect(() => checkedLink("javascript:alert(1)")).toThrow();
    expect(() => checkedLink("/relative/path")).toThrow();
  });
});

describe("templates", () => {
  const all = {
    verify: verifyAddressMail({ name: HOSTILE, link: LINK }),
    reset: passwordResetMail({ name: HOSTILE, link: LINK, expiresInMinutes: 30 }),
    invite: workspaceInviteMail({ inviterName: HOSTILE, workspaceName: `${HOSTILE}\r\nBcc: x@example.test`, role: "contractor", link: LINK }),
    field: fieldCheckMail({
      engineerName: HOSTILE,
      checkedBy: HOSTILE,
      projectName: HOSTILE,
      selectionName: HOSTILE,
      verdict: "marginal",
      detail: HOSTILE,
      link: LINK,
    }),
  };

  test.each(Object.entries(all))("%s: user text is escaped in the HTML and kept verbatim in the text", (_, m) => {
    expect(m.html).not.toContain("<script>");
    expect(m.html).toContain("&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt; &amp; &#39;Co&#39;");
    expect(m.text).toContain(`<script>alert("x")</script> & 'Co'`);
  });

  test.each(Object.entries(all))("%s: the link is in both parts, &-encoded in the href", (_, m) => {
    expect(m.text).toContain(LINK);
    expect(m.html).toContain(`href="${LINK.replace(/&/g, "&amp;")}"`);
    expect(m.html).not.toContain(`href="${LINK}"`);
  });

  test.each(Object.entries(all))("%s: the subject is one line of at most 200 characters", (_, m) => {
    expect(m.subject).not.toMatch(/[\r\n]/);
    expect([...m.subject].length).toBeLessThanOrEqual(200); // outbox.subject is varchar(200), db/schema.ts
  });

  test("a javascript: link is refused", () => {
    expect(() => passwordResetMail({ link: "javascript:alert(1)" })).toThrow(/http/);
  });

  test("reset states the expiry; verify and invite state theirs", () => {
    expect(all.reset.text).toContain("30 minutes");
    expect(all.verify.text).toContain("24 hours");
    expect(all.invite.text).toContain("7 days");
    expect(passwordResetMail({ link: LINK, expiresInMinutes: 1 }).text).toContain("1 minute.");
  });

  test("invite names inviter, workspace and role", () => {
    const m = workspaceInviteMail({ inviterName: "Mara Quist", workspaceName: "Harbour Utilities", role: "engineer", link: LINK });
    expect(m.subject).toBe("Mara Quist invited you to Harbour Utilities on Dutymark");
    expect(m.text).toContain("“Harbour Utilities”");
    expect(m.text).toContain(ROLE_PHRASES.engineer.name);
    expect(m.text).toContain(ROLE_PHRASES.engineer.can);
  });

  test("field-check notice carries project, selection, verdict and the design caution", () => {
    const m = fieldCheckMail({ projectName: "Plant 3", selectionName: "HW-P2", verdict: "fail", detail: "Delivered 41.2 m³/h at 27.9 m.", link: LINK });
    expect(m.subject).toBe("Field check on HW-P2 (Plant 3): outside tolerance");
    expect(m.text).toContain("Verdict: outside tolerance.");
    expect(m.text).toContain("Delivered 41.2 m³/h at 27.9 m.");
    // The caution wording is the product brief's ("Look and feel").
    expect(m.text).toContain("verify against the manufacturer's certified data, local codes and a licensed engineer");
    expect(fieldCheckMail({ projectName: "P", selectionName: "S", verdict: "pass", link: LINK }).subject).toMatch(/within tolerance$/);
  });
});
