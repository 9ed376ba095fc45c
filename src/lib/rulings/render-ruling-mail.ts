/**
 * The e-mail that circulates a ruling: a subject, a plain-text body and an HTML body carrying
 * the same content. Every piece of user text is escaped in the HTML (common practice, no
 * source); the plain text needs no escaping. Pure: links are passed in.
 */
import { escapeHtml } from "../text/escape-html.ts";
import { appealOutcome, APPEAL_OUTCOME_LABELS } from "./appeal-outcome.ts";
import { DECISION_LABELS, type AppealTally, type Decision } from "./ruling-content.ts";
import { formatDate } from "../text/dates.ts";

export interface RulingForMail {
  number: number;
  revision: number;
  raisedByName: string;
  targetLabel: string;
  measureLabel: string | null;
  question: string;
  decision: Decision | null;
  decisionNote: string;
  reasoning: string;
  citations: Array<{ kind: "rule"; citation: string; ruleId: string | null } | { kind: "ruling"; label?: string }>;
  appeal: AppealTally | null;
  sitting: string;
  sittingDate: string | null;
}

export interface RenderedMail {
  subject: string;
  text: string;
  html: string;
}

function citationText(c: RulingForMail["citations"][number]): string {
  // The rule's id is the rulebook's internal name: a reader gets the citation only.
  return c.kind === "rule" ? c.citation : (c.label ?? "An earlier ruling");
}

export function decisionLine(r: Pick<RulingForMail, "decision" | "decisionNote">): string {
  if (!r.decision) return "No decision recorded";
  return r.decision === "other" ? `${DECISION_LABELS.other}: ${r.decisionNote}` : DECISION_LABELS[r.decision] + (r.decisionNote ? ` — ${r.decisionNote}` : "");
}

export function appealLine(a: AppealTally): string {
  const o = appealOutcome(a);
  const tie = a.ayes === a.noes ? " (a tie sustains the chair)" : "";
  return `Appealed${a.appellant ? ` by ${a.appellant}` : ""}: ${a.ayes} to sustain, ${a.noes} against${a.abstentions ? `, ${a.abstentions} abstaining` : ""}. ${APPEAL_OUTCOME_LABELS[o]}${tie}.`;
}

export function renderRulingMail(input: { chamberName: string; ruling: RulingForMail; rulingUrl: string; unsubscribeUrl: string | null }): RenderedMail {
  const r = input.ruling;
  const title = `Ruling ${r.number}${r.revision > 1 ? ` (revision ${r.revision})` : ""}`;
  const subject = `${input.chamberName}: ${title} — ${r.targetLabel}`.slice(0, 250);
  const when = [r.sitting, r.sittingDate ? formatDate(r.sittingDate, { timeZone: "UTC" }) || r.sittingDate : null].filter(Boolean).join(", ");
  const rows: Array<[string, string]> = [
    ["Sitting", when || "—"],
    ["Raised by", r.raisedByName],
    ["Against", r.targetLabel + (r.measureLabel ? ` (${r.measureLabel})` : "")],
    ["Question", r.question],
    ["Decision", decisionLine(r)],
  ];
  const text = [
    `${input.chamberName} — ${title}`,
    "",
    ...rows.map(([k, v]) => `${k}: ${v}`),
    "",
    "Reasoning:",
    r.reasoning || "—",
    "",
    ...(r.citations.length ? ["Citations:", ...r.citations.map((c) => `- ${citationText(c)}`), ""] : []),
    ...(r.appeal ? [appealLine(r.appeal), ""] : []),
    `Read the ruling: ${input.rulingUrl}`,
    "",
    "The presiding officer's ruling, the chamber's own rules and its counsel prevail over any summary.",
    ...(input.unsubscribeUrl ? ["", `To stop receiving this list's mail: ${input.unsubscribeUrl}`] : []),
  ].join("\n");
  const e = escapeHtml;
  const html = [
    `<!doctype html><html><body style="font-family:Georgia,serif;color:#16302b;max-width:40rem">`,
    `<h1 style="font-size:1.3rem">${e(input.chamberName)} — ${e(title)}</h1>`,
    `<table style="border-collapse:collapse">`,
    ...rows.map(([k, v]) => `<tr><th style="text-align:left;padding:2px 8px 2px 0;vertical-align:top">${e(k)}</th><td style="padding:2px 0">${e(v)}</td></tr>`),
    `</table>`,
    `<h2 style="font-size:1.1rem">Reasoning</h2>`,
    ...(r.reasoning ? r.reasoning.split(/\n{2,}/).map((p) => `<p>${e(p).replace(/\n/g, "<br>")}</p>`) : ["<p>—</p>"]),
    ...(r.citations.length ? [`<h2 style="font-size:1.1rem">Citations</h2><ul>`, ...r.citations.map((c) => `<li>${e(citationText(c))}</li>`), `</ul>`] : []),
    ...(r.appeal ? [`<p><strong>Appeal.</strong> ${e(appealLine(r.appeal))}</p>`] : []),
    `<p><a href="${e(input.rulingUrl)}">Read the ruling in Gavelwright</a></p>`,
    `<p style="font-size:0.85rem;color:#44574f">The presiding officer's ruling, the chamber's own rules and its counsel prevail over any summary.</p>`,
    ...(input.unsubscribeUrl ? [`<p style="font-size:0.85rem"><a href="${e(input.unsubscribeUrl)}">Stop receiving this list's mail</a></p>`] : []),
    `</body></html>`,
  ].join("\n");
  return { subject, text, html };
}
