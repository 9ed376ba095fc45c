/**
 * The chair's script for one legal question order: each question in our own procedural wording,
 * the vote it requires, and what follows on adoption and on rejection (which later amendments fall).
 * The sequence follows the projected sincere path of the walk-through (walk-through.ts): questions
 * that fall on that path are listed as not put, with the reason. Amendments are taken second degree
 * before the first degree they amend, then final passage (Robert's Rules of Order Revised, 1915,
 * §33 [PD]), as far as the order given respects that; the order itself is the rulebook's business.
 */
import type { WalkStep, WalkThrough } from "./walk-through.ts";
import { amendmentName, listInWords, thresholdInWords, versionInWords, versionShort, type TreeLabels } from "./version-words.ts";

export interface ScriptStep {
  number: number;
  question: string;
  put: boolean;
  heading: string;
  /** What the chair says to put the question. */
  wording: string[];
  voteRequired: string;
  onAdoption: string;
  onRejection: string;
  /** The estimate's projection for this vote, shown apart from the wording. */
  projection: string;
}

export interface ChairScript {
  title: string;
  order: string[];
  steps: ScriptStep[];
  advisory: string;
}

const FORM_WORDS: Record<string, string> = {
  insert: "to insert",
  strike: "to strike out",
  "strike-and-insert": "to strike out and insert",
  substitute: "to substitute",
  "in-nature-of-substitute": "in the nature of a substitute",
};

function whereIn(a: TreeLabels["amendments"][string]): string {
  const where = a.targetLabel ?? a.target ?? "the text";
  return a.lines ? `${where}, line${a.lines[0] === a.lines[1] ? ` ${a.lines[0]}` : `s ${a.lines[0]}–${a.lines[1]}`}` : where;
}

function falls(list: string[] | undefined, labels: TreeLabels): string {
  return list && list.length ? ` ${listInWords(list.map((k) => amendmentName(k, labels)))} ${list.length === 1 ? "falls" : "fall"} and will not be put.` : "";
}

function stepFor(s: WalkStep, n: number, labels: TreeLabels, amendThreshold: string, passageThreshold: string): ScriptStep {
  const isPassage = s.question === "passage";
  const a = labels.amendments[s.question] ?? {};
  const name = isPassage ? labels.measureLabel : amendmentName(s.question, labels);
  const heading = isPassage ? `Final passage of ${labels.measureLabel}` : `${a.degree === 2 ? "Amendment to the amendment" : "Amendment"} ${name}`;
  if (!s.put)
    return { number: n, question: s.question, put: false, heading, wording: [`(Not put: ${name} has fallen as a result of an earlier decision. The chair announces that it falls.)`], voteRequired: "—", onAdoption: "—", onRejection: "—", projection: "Falls on the projected path." };
  const wording = isPassage
    ? [`The question now before the Assembly is on the passage of ${labels.measureLabel}${s.motion && s.motion !== labels.measureKey ? ", as amended" : ""}.`, "Is there any further debate? [Pause.] Members in favour of passage will vote Aye; those against, No.", "The clerk will record the vote."]
    : [
        `The question is on amendment ${name}${a.degree === 2 ? ` to amendment ${a.target}` : ""}, ${FORM_WORDS[a.form ?? ""] ?? "to amend"} ${a.form === "substitute" || a.form === "in-nature-of-substitute" ? `for ${whereIn(a)}` : `in ${whereIn(a)}`}.`,
        `Is there any further debate on ${name}? [Pause.] Members in favour of the amendment will vote Aye; those against, No.`,
        "The clerk will record the vote.",
      ];
  const tally = s.for !== undefined ? `${s.for} for, ${s.against} against` : "no tally available";
  // Successive procedure: say what a sincere "for" meant, since it is not a choice between two texts.
  const reach = s.withinReach?.length ? ` Counted for: members who rank this text above each of the other versions still within reach, namely ${listInWords(s.withinReach.map((v) => versionShort(v, labels)))}. Counted against: the others who rank it.` : "";
  return {
    number: n,
    question: s.question,
    put: true,
    heading,
    wording,
    voteRequired: thresholdInWords(isPassage ? passageThreshold : amendThreshold),
    onAdoption: isPassage
      ? `${labels.measureLabel} is passed in the form: ${versionInWords(s.motion ?? labels.measureKey, labels)}.`
      : a.degree === 2
        ? `Amendment ${a.target} is amended; if ${a.target} is then agreed to, the text becomes: ${versionInWords(s.motion ?? labels.measureKey, labels)}.${falls(s.fallsIfAdopted, labels)}`
        : `The amendment is agreed to; the text becomes: ${versionInWords(s.motion ?? labels.measureKey, labels)}.${falls(s.fallsIfAdopted, labels)}`,
    onRejection: isPassage
      ? `${labels.measureLabel} is not passed; current law stands.`
      : a.degree === 2
        ? `Amendment ${a.target} stays as filed; if it is then agreed to, the text becomes: ${versionInWords(s.base ?? labels.measureKey, labels)}.${falls(s.fallsIfRejected, labels)}`
        : `The amendment is not agreed to; the text remains: ${versionInWords(s.base ?? labels.measureKey, labels)}.${falls(s.fallsIfRejected, labels)}`,
    projection: `Projected: ${s.adopted ? "adopted" : "rejected"} (${tally}${s.castingVote ? `; the votes being equally divided, the chair gives a casting vote ${s.castingVote === "for" ? "in favour" : "against"}` : ""}).${reach}`,
  };
}

export function chairScript(walk: WalkThrough, labels: TreeLabels, passageThreshold: string, estimateTitle: string): ChairScript {
  return {
    title: `Chair's script: ${labels.measureLabel}, questions in the order ${walk.order.join(", ")}`,
    order: walk.order,
    steps: walk.sincere.steps.map((s, i) => stepFor(s, i + 1, labels, walk.threshold, walk.thresholds?.passage ?? passageThreshold)),
    advisory: `Prepared by Gavelwright as an aid. The projections come from the estimate “${estimateTitle}” under sincere voting; they are not a forecast. The presiding officer's rulings, the chamber's own rules and its counsel prevail.`,
  };
}

export function scriptMarkdown(s: ChairScript): string {
  const lines = [`# ${s.title}`, "", `> ${s.advisory}`, ""];
  for (const st of s.steps) {
    lines.push(`## ${st.number}. ${st.heading}`, "");
    for (const w of st.wording) lines.push(w, "");
    if (st.put) lines.push(`- **Vote required:** ${st.voteRequired}`, `- **If adopted:** ${st.onAdoption}`, `- **If rejected:** ${st.onRejection}`, `- *${st.projection}*`, "");
  }
  return lines.join("\n");
}
