/**
 * A vote as the clerk fills it in (result, how it was decided, the count), checked in the
 * clerk's words before anything is sent, and read back as the confirmation sentence. The server
 * checks it again (src/lib/server/floor-record.ts checkVote); field issues it returns are named
 * here by the labels the clerk sees.
 */
export interface VoteDraft {
  result: "" | "adopted" | "rejected";
  method: "" | "voice" | "division";
  yes: string;
  no: string;
  abstain: string;
}
export const EMPTY_VOTE: VoteDraft = { result: "", method: "", yes: "", no: "", abstain: "" };
export type VoteField = "result" | "method" | "yes" | "no" | "abstain";

export const VOTE_FIELD_LABELS: Record<VoteField, string> = { result: "Result", method: "How it was decided", yes: "Ayes", no: "Noes", abstain: "Abstaining" };

export interface VoteEvent {
  result: "adopted" | "rejected";
  method: "voice" | "division";
  tally: { yes: number; no: number; abstain: number } | null;
}

const WHOLE = /^\d{1,6}$/;

/** The draft checked: either the field errors (in the clerk's words) or the vote to send. */
export function checkDraft(d: VoteDraft, needsCount: boolean): { errors: Partial<Record<VoteField, string>>; vote: VoteEvent | null } {
  const errors: Partial<Record<VoteField, string>> = {};
  if (!d.result) errors.result = "Result: choose adopted or rejected.";
  if (!d.method) errors.method = "How it was decided: choose by voice or counted.";
  else if (d.method === "voice" && needsCount) errors.method = "How it was decided: this question cannot be decided without a count; choose counted.";
  if (d.method === "division") {
    for (const k of ["yes", "no"] as const) {
      const v = d[k].trim();
      if (!v) errors[k] = `${VOTE_FIELD_LABELS[k]}: enter the number (0 if none).`;
      else if (!WHOLE.test(v)) errors[k] = `${VOTE_FIELD_LABELS[k]}: “${v}” is not a whole number.`;
    }
    const a = d.abstain.trim();
    if (a && !WHOLE.test(a)) errors.abstain = `Abstaining: “${a}” is not a whole number; leave it empty if no one abstained.`;
  }
  if (Object.keys(errors).length || !d.result || !d.method) return { errors, vote: null };
  const tally = d.method === "division" ? { yes: Number(d.yes.trim()), no: Number(d.no.trim()), abstain: d.abstain.trim() ? Number(d.abstain.trim()) : 0 } : null;
  return { errors, vote: { result: d.result, method: d.method, tally } };
}

/** "rejected, 12–20, 3 abstaining" / "adopted, by voice" */
export function voteWords(v: VoteEvent): string {
  return `${v.result}, ${v.tally ? `${v.tally.yes}–${v.tally.no}${v.tally.abstain ? `, ${v.tally.abstain} abstaining` : ""}` : "by voice"}`;
}

/** A server field issue's path ("event.tally.abstain", "event.replacement.result") as the field it names. */
export function fieldOfPath(path: string): VoteField | "reason" | null {
  const last = path.split(".").pop() ?? "";
  if (last === "reason") return "reason";
  if (last === "result" || last === "method" || last === "yes" || last === "no" || last === "abstain") return last;
  if (last === "tally") return "yes";
  return null;
}
