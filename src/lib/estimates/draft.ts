/**
 * An estimate started from the roster is a draft: its rows carry the roster's blocs (or members)
 * and weights, but no ranking (ballots) or only placeholder positions (spatial) until a person
 * fills them in. A draft is never analysed: the analysis would otherwise present placeholder data
 * as a projection. A ballot row is filled when it ranks at least one version, or when it is
 * explicitly marked unranked (it then takes no part in the analysis).
 */
import type { EstimateContent } from "./estimate-content.ts";

export interface DraftGaps {
  /** Names of the ballot rows with neither a ranking nor the "unranked" mark. */
  unfilled: string[];
  /** A spatial estimate whose positions are still the roster's placeholders. */
  placeholderPositions: boolean;
  /** Rows that will be counted (ranked ballots, or every spatial member). */
  counted: number;
  rows: number;
}

export function draftGaps(c: EstimateContent): DraftGaps {
  if (c.kind === "ballots") {
    const unfilled = c.rows.filter((r) => r.ranking.length === 0 && !r.unranked).map((r) => r.member);
    return { unfilled, placeholderPositions: false, counted: c.rows.filter((r) => r.ranking.length > 0).length, rows: c.rows.length };
  }
  return { unfilled: [], placeholderPositions: c.draft === true, counted: c.members.length, rows: c.members.length };
}

export function isDraft(c: EstimateContent): boolean {
  const g = draftGaps(c);
  return g.unfilled.length > 0 || g.placeholderPositions || g.counted === 0;
}

/** What is missing, in a clerk's words; null when the estimate can be analysed. */
export function draftMessage(c: EstimateContent): string | null {
  const g = draftGaps(c);
  if (g.placeholderPositions) return "This estimate is an unfilled draft: the positions are the roster's placeholders. Place the blocs on the plot (or in the table of ideal points) and save a version; then it can be analysed.";
  if (g.unfilled.length > 0) {
    const names = g.unfilled.length <= 5 ? g.unfilled.map((n) => `“${n}”`).join(", ") : `${g.unfilled.slice(0, 4).map((n) => `“${n}”`).join(", ")} and ${g.unfilled.length - 4} more`;
    return `This estimate is an unfilled draft: ${g.unfilled.length} of ${g.rows} row${g.rows === 1 ? "" : "s"} ${g.unfilled.length === 1 ? "has" : "have"} no ranking yet (${names}). Give each row its places, or mark it unranked, and save a version; then it can be analysed.`;
  }
  if (g.counted === 0) return "Every row is marked unranked, so there is nothing to analyse. Give at least one row its places and save a version.";
  return null;
}
