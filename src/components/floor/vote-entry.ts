/**
 * A vote as the clerk fills it in (result, how it was decided, the count), checked in the
 * clerk's words before anything is sent, and read back as the confirmation sentence. The server
 * checks it again (src/lib/server/floor-record.ts checkVote); field issues it returns are named
 * here by the labels the clerk sees.
 */
import type { RollPosition } from "../../lib/procedure/voting-methods.ts";
import { ApiError } from "../shared/api.ts";

export interface VoteDraft {
  result: "" | "adopted" | "rejected";
  method: "" | "voice" | "division" | "recorded";
  yes: string;
  no: string;
  abstain: string;
  /** Recorded vote: each member's answer by legislator id. */
  roll: Record<string, RollPosition>;
  casting: "" | "yea" | "nay";
  demandedBy: string;
}
export const EMPTY_VOTE: VoteDraft = { result: "", method: "", yes: "", no: "", abstain: "", roll: {}, casting: "", demandedBy: "" };
export type VoteField = "result" | "method" | "yes" | "no" | "abstain" | "roll" | "casting" | "demandedBy";

export const VOTE_FIELD_LABELS: Record<VoteField, string> = { result: "Result", method: "How it was decided", yes: "Ayes", no: "Noes", abstain: "Abstaining", roll: "The roll", casting: "The chair's casting vote", demandedBy: "Demanded by" };

export interface VoteEvent {
  result: "adopted" | "rejected";
  method: "voice" | "division" | "recorded";
  tally: { yes: number; no: number; abstain: number } | null;
  roll?: Array<{ member: string; position: RollPosition }>;
  casting?: "yea" | "nay";
  demandedBy?: number;
}

export const POSITION_WORDS: Record<RollPosition, string> = { yea: "Yea", nay: "Nay", present: "Present", "not-voting": "Not voting", recused: "Recused" };

/** How many members gave each answer. */
export function rollCounts(roll: Record<string, RollPosition>): Record<RollPosition, number> {
  const c: Record<RollPosition, number> = { yea: 0, nay: 0, present: 0, "not-voting": 0, recused: 0 };
  for (const p of Object.values(roll)) c[p]++;
  return c;
}

const WHOLE = /^\d{1,6}$/;

/** The draft checked: either the field errors (in the clerk's words) or the vote to send. */
export function checkDraft(d: VoteDraft, needsCount: boolean, rosterSize = 0): { errors: Partial<Record<VoteField, string>>; vote: VoteEvent | null } {
  const errors: Partial<Record<VoteField, string>> = {};
  if (!d.result) errors.result = "Result: choose adopted or rejected.";
  if (!d.method) errors.method = "How it was decided: choose how the vote was taken.";
  else if (d.method === "voice" && needsCount) errors.method = "How it was decided: this question cannot be decided without a count; choose a division or a recorded vote.";
  if (d.method === "division") {
    for (const k of ["yes", "no"] as const) {
      const v = d[k].trim();
      if (!v) errors[k] = `${VOTE_FIELD_LABELS[k]}: enter the number (0 if none).`;
      else if (!WHOLE.test(v)) errors[k] = `${VOTE_FIELD_LABELS[k]}: “${v}” is not a whole number.`;
    }
    const a = d.abstain.trim();
    if (a && !WHOLE.test(a)) errors.abstain = `Abstaining: “${a}” is not a whole number; leave it empty if no one abstained.`;
  }
  if (d.method === "recorded") {
    const missing = rosterSize - Object.keys(d.roll).length;
    if (rosterSize === 0) errors.roll = "The roll: the roster has not loaded yet.";
    else if (missing > 0) errors.roll = `The roll: ${missing === 1 ? "1 member has" : `${missing} members have`} no answer yet; mark them (“Not voting” for those absent).`;
    const dem = d.demandedBy.trim();
    if (dem && !/^\d{1,6}$/.test(dem)) errors.demandedBy = `Demanded by: “${dem}” is not a whole number.`;
  }
  if (Object.keys(errors).length || !d.result || !d.method) return { errors, vote: null };
  if (d.method === "recorded") {
    const c = rollCounts(d.roll);
    const roll = Object.entries(d.roll).map(([member, position]) => ({ member, position }));
    return { errors, vote: { result: d.result, method: "recorded", tally: { yes: c.yea, no: c.nay, abstain: c.present }, roll, ...(d.casting ? { casting: d.casting } : {}), ...(d.demandedBy.trim() ? { demandedBy: Number(d.demandedBy.trim()) } : {}) } };
  }
  const tally = d.method === "division" ? { yes: Number(d.yes.trim()), no: Number(d.no.trim()), abstain: d.abstain.trim() ? Number(d.abstain.trim()) : 0 } : null;
  return { errors, vote: { result: d.result, method: d.method, tally } };
}

/** "rejected, 12–20, 3 abstaining" / "adopted, by voice" */
export function voteWords(v: VoteEvent): string {
  if (v.roll && v.tally) {
    const c = rollCounts(Object.fromEntries(v.roll.map((r) => [r.member, r.position])));
    const extra = [c.present && `${c.present} present`, c["not-voting"] && `${c["not-voting"]} not voting`, c.recused && `${c.recused} recused`].filter(Boolean).join(", ");
    return `${v.result}, ${v.tally.yes}–${v.tally.no}${extra ? `, ${extra}` : ""} (recorded vote${v.casting ? `; the chair's casting vote: ${v.casting}` : ""})`;
  }
  return `${v.result}, ${v.tally ? `${v.tally.yes}–${v.tally.no}${v.tally.abstain ? `, ${v.tally.abstain} abstaining` : ""}` : "by voice"}`;
}

/** A server field issue's path ("event.tally.abstain", "event.replacement.result") as the field it names. */
export function fieldOfPath(path: string): VoteField | "reason" | null {
  const last = path.split(".").pop() ?? "";
  if (last === "reason") return "reason";
  if (last === "result" || last === "method" || last === "yes" || last === "no" || last === "abstain" || last === "casting" || last === "demandedBy") return last;
  if (last === "tally") return "yes";
  if (path.includes(".roll")) return "roll";
  return null;
}

/**
 * A refused vote entry's field issues, each under the field it names ("Ayes: must be a whole
 * number"), or null when the refusal names no field of the form. `withReason`: the correction form,
 * which also has a reason field.
 */
export function voteFieldIssues<R extends boolean>(e: unknown, withReason: R): Partial<Record<R extends true ? VoteField | "reason" : VoteField, string>> | null {
  if (!(e instanceof ApiError) || e.status !== 400 || !e.issues.length) return null;
  const next: Partial<Record<VoteField | "reason", string>> = {};
  for (const i of e.issues) {
    const f = fieldOfPath(i.path);
    if (f === "reason" ? withReason : f) next[f!] = `${f === "reason" ? "Reason" : VOTE_FIELD_LABELS[f!]}: ${i.message}`;
  }
  return Object.keys(next).length ? next : null;
}

/**
 * Show a refused entry on its form: the field issues under their fields (when the refusal names
 * any) and the line above the button ("Not recorded: …").
 */
export function showRefusal<R extends boolean>(e: unknown, withReason: R, setErrors: (errors: NonNullable<ReturnType<typeof voteFieldIssues<R>>>) => void, setFailure: (failure: string) => void): void {
  const errors = voteFieldIssues(e, withReason);
  if (errors) setErrors(errors);
  setFailure(errors ? "Not recorded: check the fields marked above." : e instanceof Error ? e.message : "Not recorded.");
}
