/**
 * The floor-day digest sent to the clerks' list: the amendment tree's findings and the proposed
 * order of questions for a sitting, as plain text and escaped HTML (common practice, no source).
 * The content comes from the callers (tree validation, voting orders); this only lays it out.
 */
import { z } from "zod";
import { calendarDate, safe } from "../schema-parts.ts";
import { escapeHtml } from "../text/escape-html.ts";
import type { RenderedMail } from "./render-ruling-mail.ts";
import { formatDate } from "../text/dates.ts";

export const floorDigestSchema = z.object({
  sitting: safe(z.string().trim().min(1).max(200)),
  date: calendarDate(),
  measure: safe(z.string().trim().max(300)).default(""),
  findings: z
    .array(z.object({ severity: z.enum(["error", "warning", "info"]), code: safe(z.string().trim().max(64)).default(""), message: safe(z.string().trim().min(1).max(2000)), subject: safe(z.string().trim().max(300)).default("") }))
    .max(500)
    .default([]),
  proposedOrder: z.array(z.object({ label: safe(z.string().trim().min(1).max(300)), note: safe(z.string().trim().max(1000)).default("") })).max(200).default([]),
  note: safe(z.string().trim().max(4000)).default(""),
});
export type FloorDigest = z.output<typeof floorDigestSchema>;

const SEVERITY: Record<FloorDigest["findings"][number]["severity"], string> = { error: "Out of order", warning: "Query", info: "Note" };

export function renderFloorDigest(input: { chamberName: string; digest: FloorDigest; unsubscribeUrl: string | null }): RenderedMail {
  const d = input.digest;
  // A calendar date: the same day in every zone (dates.ts keeps a bare date whole).
  const day = formatDate(d.date, { timeZone: "UTC" }) || d.date;
  const subject = `${input.chamberName}: floor-day digest — ${d.sitting}, ${day}`.slice(0, 250);
  const findingLine = (f: FloorDigest["findings"][number]) => `${SEVERITY[f.severity]}${f.code ? ` [${f.code}]` : ""}${f.subject ? ` ${f.subject}:` : ":"} ${f.message}`;
  const text = [
    `${input.chamberName} — floor-day digest`,
    `${d.sitting}, ${day}${d.measure ? ` — ${d.measure}` : ""}`,
    "",
    ...(d.note ? [d.note, ""] : []),
    `Findings (${d.findings.length}):`,
    ...(d.findings.length ? d.findings.map((f) => `- ${findingLine(f)}`) : ["- none"]),
    "",
    `Proposed order of questions (${d.proposedOrder.length}):`,
    ...(d.proposedOrder.length ? d.proposedOrder.map((q, i) => `${i + 1}. ${q.label}${q.note ? ` — ${q.note}` : ""}`) : ["- none proposed"]),
    "",
    "Advisory only: the presiding officer's ruling, the chamber's own rules and its counsel prevail.",
    ...(input.unsubscribeUrl ? ["", `To stop receiving this list's mail: ${input.unsubscribeUrl}`] : []),
  ].join("\n");
  const e = escapeHtml;
  const html = [
    `<!doctype html><html><body style="font-family:Georgia,serif;color:#16302b;max-width:40rem">`,
    `<h1 style="font-size:1.3rem">${e(input.chamberName)} — floor-day digest</h1>`,
    `<p>${e(d.sitting)}, ${e(day)}${d.measure ? ` — ${e(d.measure)}` : ""}</p>`,
    ...(d.note ? [`<p>${e(d.note)}</p>`] : []),
    `<h2 style="font-size:1.1rem">Findings (${d.findings.length})</h2>`,
    d.findings.length ? `<ul>${d.findings.map((f) => `<li>${e(findingLine(f))}</li>`).join("")}</ul>` : "<p>None.</p>",
    `<h2 style="font-size:1.1rem">Proposed order of questions (${d.proposedOrder.length})</h2>`,
    d.proposedOrder.length ? `<ol>${d.proposedOrder.map((q) => `<li>${e(q.label)}${q.note ? ` — ${e(q.note)}` : ""}</li>`).join("")}</ol>` : "<p>None proposed.</p>",
    `<p style="font-size:0.85rem;color:#44574f">Advisory only: the presiding officer's ruling, the chamber's own rules and its counsel prevail.</p>`,
    ...(input.unsubscribeUrl ? [`<p style="font-size:0.85rem"><a href="${e(input.unsubscribeUrl)}">Stop receiving this list's mail</a></p>`] : []),
    `</body></html>`,
  ].join("\n");
  return { subject, text, html };
}
