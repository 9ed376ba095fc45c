/**
 * Plain-language names for the alternatives of an amendment tree (docs/sources.md §1: versions of the text,
 * Q the status quo). Version ids come from the voting engine: "Q", the measure's key, and
 * "<measure>+<amendment keys>" (src/lib/voting/amendment-versions.ts).
 */
export interface TreeLabels {
  /** The measure's key in version ids (e.g. "measure") and its public label (e.g. "HCA 12"). */
  measureKey: string;
  measureLabel: string;
  /** Per amendment key: `label` is what people read for it ("A3"; a draft's "Draft", whose key is internal). */
  amendments: Record<string, { label?: string; title?: string | null; form?: string; target?: string; targetLabel?: string; lines?: [number, number] | null; degree?: 1 | 2 }>;
}

export const STATUS_QUO_ID = "Q";

export function listInWords(items: readonly string[]): string {
  if (items.length <= 1) return items.join("");
  return `${items.slice(0, -1).join(", ")} and ${items[items.length - 1]}`;
}

/** An amendment key as people read it: its label when it has one ("Draft"), else the key ("A3"). */
export function keyLabel(key: string, labels: TreeLabels): string {
  return labels.amendments[key]?.label ?? key;
}

export function amendmentName(key: string, labels: TreeLabels): string {
  const t = labels.amendments[key]?.title;
  return t ? `${keyLabel(key, labels)} (${t})` : keyLabel(key, labels);
}

export function versionInWords(id: string, labels: TreeLabels): string {
  if (id === STATUS_QUO_ID) return `No change: ${labels.measureLabel} fails and current law stands`;
  if (id === labels.measureKey) return `${labels.measureLabel} as introduced, without amendment`;
  const keys = id.startsWith(`${labels.measureKey}+`) ? id.slice(labels.measureKey.length + 1).split("+") : [id];
  return `${labels.measureLabel} as amended by ${listInWords(keys.map((k) => amendmentName(k, labels)))}`;
}

/** Short label for charts: "Q (no change)", "HCA 12", "HCA 12 + A1 + A2". */
export function versionShort(id: string, labels: TreeLabels): string {
  if (id === STATUS_QUO_ID) return "Q (no change)";
  if (id === labels.measureKey) return labels.measureLabel;
  return id.startsWith(`${labels.measureKey}+`) ? `${labels.measureLabel} + ${id.slice(labels.measureKey.length + 1).split("+").map((k) => keyLabel(k, labels)).join(" + ")}` : id;
}

const THRESHOLD_WORDS: Record<string, string> = {
  majority: "a majority of the votes cast (a tie defeats the question)",
  "two-thirds": "two-thirds of the votes cast",
  "majority-of-members": "a majority of all members",
  none: "a majority of the votes cast (a tie defeats the question)",
  "two-thirds-of-members": "two-thirds of all members",
  "three-fifths-of-members": "three-fifths of all members",
  "two-thirds-of-present": "two-thirds of the members present",
};

export function thresholdInWords(t: string): string {
  const fixed = /^(\d+) votes$/.exec(t);
  if (fixed) return `at least ${fixed[1]} votes in favour, and more for than against`;
  return THRESHOLD_WORDS[t] ?? t;
}
