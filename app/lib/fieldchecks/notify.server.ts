// The engineer's notice of a recorded field check (or amendment), by e-mail in the engineer's units: who checked,
// the verdict, the delivered point, and when the readings were taken (the phone's clock) and recorded (the server's).
import { eq } from "drizzle-orm";
import { db } from "@db/client.server";
import { users } from "@db/schema";
import type { Viewer } from "../libraries";
import { sendMail } from "../mail/outbox.server";
import { escapeHtml, fieldCheckMail, oneLine } from "../mail/templates";
import { appUrl } from "../auth/accounts.server";
import { deliveredSentence } from "./sentences";
import { renderUnits } from "../shared/units";
import { readStoredUnits } from "../auth/stored-units";
import { verdictNote, type CheckResult } from "./result";
import type { CheckTimes } from "./taken-at";

/** The selection as the notice needs it (what `fieldSelection` reads). */
export type NoticeSelection = { title: string; projectName: string; createdBy: string | null; projectCreatedBy: string | null };

/** When, in the notice's words: "Readings taken … (device clock) · recorded …." and why the device time cannot be right. */
function whenSentences(times: CheckTimes): string {
  const said = `${times.text.charAt(0).toUpperCase()}${times.text.slice(1)}`.replace(/^Taken /, "Readings taken ");
  return [`${said}.`, ...times.warnings].join(" ");
}

/**
 * Why a check with a flow meter has no tolerance verdict, as the check says it (evaluate.ts's "No tolerance verdict: …" note,
 * with its rule and numbers: the measured speed outside the affinity range, or a liquid with no curve to hold the pump to).
 */
function whyNoVerdict(r: CheckResult): string {
  return verdictNote(r) ?? `No tolerance verdict: ${r.message} (the check says why).`;
}

export async function notifyEngineer(viewer: Viewer, sel: NoticeSelection, checkId: number, r: CheckResult, kind: "new" | "amended", times: CheckTimes) {
  const userId = sel.createdBy ?? sel.projectCreatedBy;
  if (!userId) return null;
  const [to] = await db().select({ email: users.email, name: users.name, unitSystem: users.unitSystem, units: users.units }).from(users).where(eq(users.id, userId));
  if (!to) return null;
  const [me] = await db().select({ name: users.name, email: users.email }).from(users).where(eq(users.id, viewer.userId));
  const checkedBy = `${me?.name || me?.email || "A member"} (${viewer.workspace.name})`;
  const link = `${appUrl()}/field/checks/${checkId}`;
  const units = readStoredUnits(to.unitSystem, to.units).units; // the mail speaks the engineer's units (the defaults when they cannot be read, as the pages)
  const title = renderUnits(sel.title, units);
  const detail = `${kind === "amended" ? "This is an amended version of an earlier check. " : ""}${renderUnits(deliveredSentence(r), units)} ${whenSentences(times)}`;
  let msg;
  if (r.verdict === "unknown") {
    // The shared template has words for pass / marginal / fail only; without a flow meter there is no verdict.
    const selection = oneLine(title);
    const project = oneLine(sel.projectName);
    const text = [
      to.name ? `Hello ${oneLine(to.name)},` : "Hello,",
      "",
      `${oneLine(checkedBy)} recorded a field check on the selection “${selection}” in the project “${project}”.`,
      r.engine.flowSource !== "measured"
        ? "No tolerance verdict: there was no flow meter, so the flow was inferred from the curve."
        : oneLine(renderUnits(whyNoVerdict(r), units), 2000), // the check's own words, whole: cut at 120 characters it lost its numbers
      detail,
      "",
      `Open the field check: ${link}`,
      "",
      "Figures are for design guidance; verify against the manufacturer's certified data, local codes and a licensed engineer.",
    ].join("\n");
    const html = text
      .split("\n")
      .map((l) => (l.startsWith("Open the field check: ") ? `<p><a href="${escapeHtml(link)}">Open the field check</a></p>` : l ? `<p>${escapeHtml(l)}</p>` : ""))
      .join("");
    msg = { subject: `Field check on ${selection} (${project}): no tolerance verdict`, text, html };
  } else {
    msg = fieldCheckMail({ engineerName: to.name, checkedBy, projectName: sel.projectName, selectionName: title, verdict: r.verdict, detail, link });
  }
  try {
    return await sendMail({ to: to.email, ...msg });
  } catch (e) {
    // The check is recorded; a mail that cannot even be queued is logged, not fatal.
    console.error(`[fieldchecks] notice for check ${checkId} not queued: ${e instanceof Error ? e.message : e}`);
    return null;
  }
}
