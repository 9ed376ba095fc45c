/**
 * The chair's script for one legal question order: each question in our own procedural wording,
 * the vote it requires, and what follows on adoption and on rejection (which later amendments fall).
 * The sequence follows the projected sincere path of the walk-through (walk-through.ts): questions
 * that fall on that path are listed as not put, with the reason. Amendments are taken second degree
 * before the first degree they amend, then final passage (Robert's Rules of Order Revised, 1915,
 * §33 [PD]), as far as the order given respects that; the order itself is the rulebook's business.
 */
import type { BranchNext, BranchStep, WalkStep, WalkThrough } from "./walk-through.ts";
import { documentMarkdown, type Block, type DocumentModel } from "../documents/model.ts";
import { amendmentName, keyLabel, listInWords, thresholdInWords, versionInWords, versionShort, type TreeLabels } from "./version-words.ts";

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

/** One question as it can be put on some branch, with the words for each result and what follows. */
export interface BranchScriptStep {
  number: number;
  question: string;
  heading: string;
  /** How the chamber gets here ("The first question.", "After step 1 is adopted."). */
  reached: string;
  wording: string[];
  voteRequired: string;
  /** What the chair says on adoption / rejection, and what follows (questions that fall, the next step). */
  adoptionWords: string;
  onAdoption: string;
  rejectionWords: string;
  onRejection: string;
  projected: boolean;
}

export interface ChairScript {
  title: string;
  order: string[];
  steps: ScriptStep[];
  /** Every branch: each question as it can come to a vote, in the order it can arise. */
  branches: BranchScriptStep[];
  /** Questions that fall before any vote. */
  fallsAtStart: string[];
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

function questionHeading(question: string, labels: TreeLabels): string {
  if (question === "passage") return `Final passage of ${labels.measureLabel}`;
  const a = labels.amendments[question] ?? {};
  return `${a.degree === 2 ? "Amendment to the amendment" : "Amendment"} ${amendmentName(question, labels)}`;
}

/** What the chair says to put a question (the same words on every branch). */
function putWording(question: string, motion: string | undefined, labels: TreeLabels): string[] {
  const isPassage = question === "passage";
  const a = labels.amendments[question] ?? {};
  const name = isPassage ? labels.measureLabel : amendmentName(question, labels);
  return isPassage
    ? [`The question now before the Assembly is on the passage of ${labels.measureLabel}${motion && motion !== labels.measureKey ? ", as amended" : ""}.`, "Is there any further debate? [Pause.] Members in favour of passage will vote Aye; those against, No.", "The clerk will record the vote."]
    : [
        `The question is on amendment ${name}${a.degree === 2 ? ` to amendment ${a.target}` : ""}, ${FORM_WORDS[a.form ?? ""] ?? "to amend"} ${a.form === "substitute" || a.form === "in-nature-of-substitute" ? `for ${whereIn(a)}` : `in ${whereIn(a)}`}.`,
        `Is there any further debate on ${name}? [Pause.] Members in favour of the amendment will vote Aye; those against, No.`,
        "The clerk will record the vote.",
      ];
}

function stepFor(s: WalkStep, n: number, labels: TreeLabels, amendThreshold: string, passageThreshold: string): ScriptStep {
  const isPassage = s.question === "passage";
  const a = labels.amendments[s.question] ?? {};
  const name = isPassage ? labels.measureLabel : amendmentName(s.question, labels);
  const heading = isPassage ? `Final passage of ${labels.measureLabel}` : `${a.degree === 2 ? "Amendment to the amendment" : "Amendment"} ${name}`;
  if (!s.put)
    return { number: n, question: s.question, put: false, heading, wording: [`(Not put: ${name} has fallen as a result of an earlier decision. The chair announces that it falls.)`], voteRequired: "—", onAdoption: "—", onRejection: "—", projection: "Falls on the projected path." };
  const wording = putWording(s.question, s.motion, labels);
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

/** "Next: step 4, Amendment A3." / "No question remains: HCA 1 is passed in the form …" */
function nextWords(n: BranchNext, labels: TreeLabels, byId: Map<number, BranchStep>): string {
  const falls = falls_(n.falls, labels);
  if (n.next !== null) {
    const h = questionHeading(byId.get(n.next)!.question, labels);
    return `${falls}Next: step ${n.next}, ${h[0].toLowerCase()}${h.slice(1)}.`;
  }
  if (n.outcome === null) return `${falls}(The script stops here: the tree has too many branches to write out.)`;
  return `${falls}No question remains. The result: ${versionInWords(n.outcome, labels)}.`;
}
function falls_(list: string[], labels: TreeLabels): string {
  return list.length ? `${listInWords(list.map((k) => amendmentName(k, labels)))} ${list.length === 1 ? "falls" : "fall"} and will not be put; the chair announces it. ` : "";
}

function branchStep(b: BranchStep, labels: TreeLabels, byId: Map<number, BranchStep>, amendThreshold: string, passageThreshold: string): BranchScriptStep {
  const isPassage = b.question === "passage";
  const a = labels.amendments[b.question] ?? {};
  const what = isPassage ? `${labels.measureLabel} is passed` : a.degree === 2 ? "the amendment to the amendment is agreed to" : "the amendment is agreed to";
  const whatNot = isPassage ? `${labels.measureLabel} is not passed` : a.degree === 2 ? "the amendment to the amendment is not agreed to" : "the amendment is not agreed to";
  const reached = b.from.length
    ? `Reached ${b.from.map((f) => `after step ${f.step} is ${f.adopted ? "adopted" : "rejected"}`).join("; or ")}.`
    : "The first question.";
  return {
    number: b.id,
    question: b.question,
    heading: questionHeading(b.question, labels),
    reached,
    wording: putWording(b.question, b.motion, labels),
    voteRequired: thresholdInWords(isPassage ? passageThreshold : amendThreshold),
    // The form of announcing the result: "the ayes have it and the motion is adopted" (paraphrase of Robert's Rules of Order Revised, 1915, §46).
    adoptionWords: `The ayes have it, and ${what}.`,
    onAdoption: `${isPassage ? `${labels.measureLabel} is passed in the form: ${versionInWords(b.motion, labels)}.` : `The text becomes: ${versionInWords(b.motion, labels)}.`} ${nextWords(b.ifAdopted, labels, byId)}`,
    rejectionWords: `The noes have it, and ${whatNot}.`,
    onRejection: `${isPassage ? `${labels.measureLabel} is not passed; current law stands.` : `The text remains: ${versionInWords(b.base, labels)}.`} ${nextWords(b.ifRejected, labels, byId)}`,
    projected: b.projected,
  };
}

export function chairScript(walk: WalkThrough, labels: TreeLabels, passageThreshold: string, estimateTitle: string): ChairScript {
  const passage = walk.thresholds?.passage ?? passageThreshold;
  const byId = new Map((walk.branches ?? []).map((b) => [b.id, b]));
  return {
    title: `Chair's script: ${labels.measureLabel}, questions in the order ${walk.order.map((q) => (q === "passage" ? "final passage" : keyLabel(q, labels))).join(", ")}`,
    order: walk.order,
    steps: walk.sincere.steps.map((s, i) => stepFor(s, i + 1, labels, walk.threshold, passage)),
    branches: (walk.branches ?? []).map((b) => branchStep(b, labels, byId, walk.threshold, passage)),
    fallsAtStart: (walk.fallsAtStart ?? []).map((k) => keyLabel(k, labels)),
    advisory: `Prepared by Gavelwright as an aid. The projections come from the estimate “${estimateTitle}” under sincere voting; they are not a forecast. The presiding officer's rulings, the chamber's own rules and its counsel prevail.`,
  };
}

/** Where and when the script is used: printed on its first page (left blank to fill in when not given). */
export interface ScriptOccasion {
  chamber?: string;
  sitting?: string;
  date?: string;
}

/** The chair's script as a document: every branch step with its words, what follows, and a tally line. */
export function scriptDocument(s: ChairScript, occasion: ScriptOccasion = {}): DocumentModel {
  const blocks: Block[] = [{ kind: "note", text: s.advisory }];
  if (s.fallsAtStart.length) blocks.push({ kind: "paragraph", runs: [{ text: `Before the first vote: ${s.fallsAtStart.join(", ")} ${s.fallsAtStart.length === 1 ? "falls" : "fall"}.` }] });
  blocks.push({ kind: "paragraph", runs: [{ text: "Every branch is written out: after each vote, go to the step named for the result. Steps marked “projected” are on the path the estimate projects." , italic: true }] });
  for (const b of s.branches) {
    blocks.push({ kind: "heading", level: 2, text: `Step ${b.number}. ${b.heading}${b.projected ? " (projected)" : ""}` });
    blocks.push({ kind: "paragraph", runs: [{ text: b.reached, italic: true }] });
    for (const w of b.wording) blocks.push({ kind: "paragraph", runs: [{ text: w }] });
    blocks.push({ kind: "paragraph", runs: [{ text: "Vote required: ", bold: true }, { text: b.voteRequired }] });
    blocks.push({ kind: "tally", labels: ["Ayes", "Noes", "Abstaining"] });
    blocks.push({
      kind: "list",
      items: [
        [{ text: "If adopted, say: ", bold: true }, { text: `“${b.adoptionWords}” ${b.onAdoption}` }],
        [{ text: "If rejected, say: ", bold: true }, { text: `“${b.rejectionWords}” ${b.onRejection}` }],
      ],
    });
  }
  blocks.push({ kind: "heading", level: 2, text: "The projected path" });
  blocks.push({ kind: "list", items: s.steps.map((st) => [{ text: `${st.number}. ${st.heading}: `, bold: true }, { text: st.projection }]) });
  const sitting = occasion.sitting || "Sitting: ______________________";
  const date = occasion.date || "Date: ______________";
  return { title: s.title, subtitle: [...(occasion.chamber ? [occasion.chamber] : []), `${sitting} — ${date}`], blocks, footer: s.title };
}

export function scriptMarkdown(s: ChairScript, occasion: ScriptOccasion = {}): string {
  return documentMarkdown(scriptDocument(s, occasion));
}
