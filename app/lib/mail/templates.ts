// E-mail texts. Pure functions: data in, { subject, text, html } out, ready for sendMail().
// Every value that came from a person (names, workspace, project, notes) is escaped in the HTML
// and flattened to one line in the subject; links must be http(s).
import type { Role } from "@db/schema";

export type MailContent = { subject: string; text: string; html: string };

const BRAND = "#0f5c55"; // --color-brand-700 in app/app.css
const INK = "#0f172a"; // slate-900
const MUTED = "#475569"; // slate-600
const DUTY = "#d97706"; // --color-duty
const FAIL = "#b91c1c"; // --color-fail

/** Escapes text for HTML element content and double- or single-quoted attribute values. */
export function escapeHtml(s: string): string {
  return s
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/"/g, "&quot;")
    .replace(/'/g, "&#39;");
}

/** User-perceived characters (Unicode extended grapheme clusters, UAX #29): a letter with its combining marks, an emoji with its modifiers and joiners. */
const GRAPHEMES = new Intl.Segmenter(undefined, { granularity: "grapheme" });

/**
 * One line, no control characters, at most `max` code points (subjects and short labels). A longer one is cut between
 * user-perceived characters — never inside a surrogate pair, between a letter and its combining mark, or inside an emoji
 * sequence (a skin tone, a joined family) — and ends with "…" to say it was cut; the "…" counts within `max`.
 */
export function oneLine(s: string, max = 120): string {
  // eslint-disable-next-line no-control-regex -- control characters are exactly what is replaced
  const flat = s.replace(/[\u0000-\u001f\u007f]+/g, " ").replace(/\s+/g, " ").trim();
  if ([...flat].length <= max) return flat;
  let kept = "";
  let count = 0;
  for (const { segment } of GRAPHEMES.segment(flat)) {
    const n = [...segment].length;
    if (count + n > max - 1) break;
    kept += segment;
    count += n;
  }
  return `${kept.trimEnd()}…`;
}

/** Accepts only absolute http(s) links: a mail must never carry a javascript: or data: link. */
export function checkedLink(link: string): string {
  let u: URL;
  try {
    u = new URL(link);
  } catch {
    throw new Error(`not an absolute link: ${JSON.stringify(link)}`);
  }
  if (u.protocol !== "http:" && u.protocol !== "https:") throw new Error(`only http(s) links go in e-mail, got ${u.protocol}`);
  return u.toString();
}

function plural(n: number, one: string, many: string) {
  return `${n} ${n === 1 ? one : many}`;
}

type Block = { text: string; html: string };
/** A paragraph from plain text (escaped for HTML). */
const para = (text: string): Block => ({
  text,
  html: `<p style="margin:0 0 14px 0">${escapeHtml(text)}</p>`,
});

function compose(opts: {
  subject: string;
  greeting: string;
  before: Block[];
  action: { label: string; link: string };
  after: Block[];
}): MailContent {
  const link = checkedLink(opts.action.link);
  const text = [
    opts.greeting,
    "",
    ...opts.before.flatMap((b) => [b.text, ""]),
    `${opts.action.label}:`,
    link,
    "",
    ...opts.after.flatMap((b) => [b.text, ""]),
    "— Dutymark",
    "",
  ].join("\n");
  const html = `<!doctype html>
<html lang="en">
<head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>${escapeHtml(opts.subject)}</title></head>
<body style="margin:0;padding:24px;background:#f8fafc;font-family:'Source Sans 3',Segoe UI,Helvetica,Arial,sans-serif;font-size:15px;line-height:1.5;color:${INK}">
<div style="max-width:560px;margin:0 auto;background:#ffffff;border:1px solid #e2e8f0;border-radius:8px;padding:24px">
<p style="margin:0 0 16px 0;font-weight:700;color:${BRAND};letter-spacing:0.02em">Dutymark</p>
<p style="margin:0 0 14px 0">${escapeHtml(opts.greeting)}</p>
${opts.before.map((b) => b.html).join("\n")}
<p style="margin:20px 0"><a href="${escapeHtml(link)}" style="display:inline-block;background:${BRAND};color:#ffffff;text-decoration:none;font-weight:600;padding:8px 16px;border-radius:6px">${escapeHtml(opts.action.label)}</a></p>
<p style="margin:0 0 14px 0;font-size:13px;color:${MUTED}">If the button does not open, copy this link into your browser:<br><a href="${escapeHtml(link)}" style="color:${BRAND};word-break:break-all">${escapeHtml(link)}</a></p>
${opts.after.map((b) => b.html).join("\n")}
</div>
</body>
</html>
`;
  return { subject: oneLine(opts.subject, 200), text, html };
}

const hello = (name?: string | null) => (name && oneLine(name) ? `Hello ${oneLine(name)},` : "Hello,");

/** Asks a new account holder to confirm their address. */
export function verifyAddressMail(p: { name?: string | null; link: string; expiresInHours?: number }): MailContent {
  const hours = p.expiresInHours ?? 24;
  return compose({
    subject: "Confirm your e-mail address for Dutymark",
    greeting: hello(p.name),
    before: [
      para(
        "Please confirm that this address is yours. Once it is confirmed, Dutymark can send you workspace invitations, password links and field-check notices here.",
      ),
    ],
    action: { label: "Confirm this address", link: p.link },
    after: [
      para(`The link works for ${plural(hours, "hour", "hours")}.`),
      para("If you did not sign up for Dutymark, you can ignore this message; without the confirmation nothing happens."),
    ],
  });
}

/** Sends a one-time link to choose a new password. */
export function passwordResetMail(p: { name?: string | null; link: string; expiresInMinutes?: number }): MailContent {
  const minutes = p.expiresInMinutes ?? 60;
  return compose({
    subject: "Choose a new Dutymark password",
    greeting: hello(p.name),
    before: [para("We were asked to replace the password of the Dutymark account that uses this address.")],
    action: { label: "Choose a new password", link: p.link },
    after: [
      para(`The link can be used once and stops working after ${plural(minutes, "minute", "minutes")}.`),
      para("If you did not ask for this, ignore this message: your current password stays as it is."),
    ],
  });
}

/** What each role may do, in a few words (for invitations). */
export const ROLE_PHRASES: Record<Role, { name: string; can: string }> = {
  admin: { name: "an admin", can: "invite people, set roles and manage the plan" },
  engineer: { name: "an engineer", can: "build system curves, compare pumps and save selections" },
  distributor: { name: "a distributor", can: "keep pump libraries up to date and publish them" },
  contractor: { name: "a contractor", can: "record field checks against saved selections" },
  viewer: { name: "a viewer", can: "read projects, selections and reports" },
};

/** Invites someone into a workspace with a role. */
export function workspaceInviteMail(p: {
  inviterName: string;
  workspaceName: string;
  role: Role;
  link: string;
  expiresInDays?: number;
}): MailContent {
  const inviter = oneLine(p.inviterName) || "A colleague";
  const workspace = oneLine(p.workspaceName);
  const role = ROLE_PHRASES[p.role];
  if (!role) throw new Error(`unknown role ${JSON.stringify(p.role)}`);
  const days = p.expiresInDays ?? 7;
  return compose({
    subject: `${inviter} invited you to ${workspace} on Dutymark`,
    greeting: "Hello,",
    before: [
      para(`${inviter} would like you to join the workspace “${workspace}” on Dutymark as ${role.name}.`),
      para(`In that role you can ${role.can}.`),
    ],
    action: { label: "Accept the invitation", link: p.link },
    after: [
      para(`The invitation stays open for ${plural(days, "day", "days")}. If you do not have an account yet, you can create one on the way.`),
      para("Not expecting this? Ignore the message and nothing changes."),
    ],
  });
}

/** Tells an admin of a workspace that another workspace offers it a project for field checks, to accept or decline. */
export function shareOfferMail(p: { adminName?: string | null; offeredBy?: string | null; fromWorkspace: string; toWorkspace: string; projectName: string; link: string }): MailContent {
  const from = oneLine(p.fromWorkspace);
  const to = oneLine(p.toWorkspace);
  const project = oneLine(p.projectName);
  const who = p.offeredBy && oneLine(p.offeredBy) ? `${oneLine(p.offeredBy)} of “${from}”` : `“${from}”`;
  return compose({
    subject: `${from} offers the project ${project} to ${to} on Dutymark`,
    greeting: hello(p.adminName),
    before: [
      para(`${who} offers the project “${project}” to your workspace “${to}”, for field checks.`),
      para(
        `If an admin of “${to}” accepts, its members see the project's selections under Field checks, record checks against them and see every check recorded on them. Until then your workspace sees nothing of the project.`,
      ),
    ],
    action: { label: "Accept or decline the offer", link: p.link },
    after: [para("Not expecting this? Decline it on that page, or leave it: an offer nobody accepts opens nothing.")],
  });
}

export type FieldVerdict = "pass" | "marginal" | "fail";
export const VERDICT_WORDS: Record<FieldVerdict, { short: string; colour: string }> = {
  pass: { short: "within tolerance", colour: BRAND },
  marginal: { short: "at the tolerance limit", colour: DUTY },
  fail: { short: "outside tolerance", colour: FAIL },
};

/** Tells the engineer of a selection that a field check was recorded, with its verdict. */
export function fieldCheckMail(p: {
  engineerName?: string | null;
  checkedBy?: string | null;
  projectName: string;
  selectionName: string;
  verdict: FieldVerdict;
  /** One or two sentences with the delivered duty point, e.g. "Delivered 41.2 m³/h at 27.9 m (duty 45 m³/h at 30 m)." */
  detail?: string | null;
  link: string;
}): MailContent {
  const v = VERDICT_WORDS[p.verdict];
  if (!v) throw new Error(`unknown verdict ${JSON.stringify(p.verdict)}`);
  const project = oneLine(p.projectName);
  const selection = oneLine(p.selectionName);
  const who = p.checkedBy && oneLine(p.checkedBy) ? oneLine(p.checkedBy) : "A contractor";
  const before = [
    para(`${who} recorded a field check on the selection “${selection}” in the project “${project}”.`),
    {
      text: `Verdict: ${v.short}.`,
      html: `<p style="margin:0 0 14px 0">Verdict: <span style="display:inline-block;padding:1px 10px;border-radius:10px;border:1px solid ${v.colour};color:${v.colour};font-weight:600">${escapeHtml(v.short)}</span></p>`,
    },
  ];
  if (p.detail?.trim()) before.push(para(p.detail.trim()));
  return compose({
    subject: `Field check on ${selection} (${project}): ${v.short}`,
    greeting: hello(p.engineerName),
    before,
    action: { label: "Open the field check", link: p.link },
    after: [
      para(
        "Figures are for design guidance; verify against the manufacturer's certified data, local codes and a licensed engineer.",
      ),
    ],
  });
}
