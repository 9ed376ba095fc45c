// Shared set-up for the rulings and circulation tests: a valid ruling body for Harrowmere.
import { asc, eq } from "drizzle-orm";
import { db } from "../../../src/lib/server/db.ts";
import { legislators } from "../../../src/lib/db/schema/chamber.ts";

export async function harrowmereLegislators(chamberId: string) {
  return db.select({ id: legislators.id, name: legislators.name }).from(legislators).where(eq(legislators.chamberId, chamberId)).orderBy(asc(legislators.name));
}

export function rulingBody(raisedById: string, over: Record<string, unknown> = {}) {
  return {
    raisedById,
    target: { kind: "motion", ref: "previous-question", label: "Previous question on the Lantern Quay Lighting Order" },
    motion: "previous-question",
    question: "Was the previous question carried by the show of hands?",
    decision: "not-sustained",
    reasoning: "The division superseded the show of hands; twenty-six of thirty-nine is two-thirds, so the previous question was carried.",
    citations: [{ kind: "rule", ruleId: "previous-question", citation: "RONR (1915) §29" }],
    sitting: "Second sitting",
    sittingDate: "2026-04-02",
    ...over,
  };
}
