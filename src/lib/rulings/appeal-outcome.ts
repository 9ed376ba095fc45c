/**
 * The result of an appeal from the decision of the chair. The question put is "Shall the
 * decision of the chair stand as the judgment of the assembly?"; the decision is reversed
 * only by a majority in the negative, so a tie sustains the chair — Robert's Rules of Order
 * Revised (1915) §21. The rulebook names the rule (`voting.appealTieRule`); only
 * "chair-sustained" exists today.
 */
import { GavelError } from "../errors.ts";
import type { AppealTally } from "./ruling-content.ts";

export type AppealOutcome = "chair-sustained" | "chair-overruled";

export function appealOutcome(tally: Pick<AppealTally, "ayes" | "noes">, tieRule: "chair-sustained" = "chair-sustained"): AppealOutcome {
  for (const k of ["ayes", "noes"] as const) {
    const v = tally[k];
    if (!Number.isInteger(v) || v < 0) throw new GavelError("invalid-input", `appeal.${k} must be a whole number of votes, 0 or more`, { issues: [{ path: `appeal.${k}`, message: "must be a whole number, 0 or more" }] });
  }
  if (tally.noes > tally.ayes) return "chair-overruled";
  if (tally.noes < tally.ayes) return "chair-sustained";
  return tieRule;
}

export const APPEAL_OUTCOME_LABELS: Record<AppealOutcome, string> = {
  "chair-sustained": "The decision of the chair stands",
  "chair-overruled": "The decision of the chair is reversed",
};
