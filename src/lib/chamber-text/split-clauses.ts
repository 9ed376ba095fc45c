/**
 * Split the text of a chamber's rules (extracted from a PDF, a Word file, plain text or Markdown) into
 * numbered clauses, as the document numbers them: rules and orders by their heading ("Rule XVI",
 * "Standing Order No. 32", "S.O. 32", "Article 12", "§33"), then clauses and paragraphs by their
 * markers ("4.", "12.3", "(1)", "(a)", "(A)", "(ii)").
 *
 * The outline is read as a clerk reads it: the first marker of a new kind opens a deeper level, a marker
 * of a kind already open is a sibling at that level (closing everything below it), and a heading word
 * always starts again from its own level. A marker counts only at the start of a line that follows the
 * end of a sentence (". : ; —", or "; and" / "; or") or a blank line, so a PDF line wrapped before
 * "(a) of this rule" stays in the sentence it continues.
 *
 * Each clause gets a citation label ("Rule XVI, clause 4(a)", "SO 32(1)", "§33", "1(a)") and a key
 * unique within the document ("rule-xvi/4/a"), which links from a rulebook (`clause`) point at.
 * Pure: no I/O.
 */
import { GavelError } from "../errors.ts";

export interface Clause {
  /** Unique within the document: the numbering steps, lower-case, joined by "/" ("rule-xvi/4/a"). */
  key: string;
  /** The clause as a citation reads it: "Rule XVI, clause 4(a)", "SO 32(1)", "§33", "1(a)". */
  label: string;
  /** The numbering steps from the top, as written: ["Rule XVI", "4", "(a)"]. */
  path: string[];
  /** 0 for the top level. */
  level: number;
  /** The key of the clause this one is part of, or null at the top. */
  parent: string | null;
  /** The words on a heading line after its number ("Order of Business"), or null. */
  title: string | null;
  /** The clause's own text (not its sub-clauses'), lines joined. */
  text: string;
  /** 1-based line of the source text where the clause starts. */
  line: number;
}

/** A chamber's rules run to a few thousand clauses; a document that splits into more is refused. */
export const MAX_CLAUSES = 5000;

export interface SplitResult {
  clauses: Clause[];
  /** Text before the first numbered clause (a title page, an enacting formula). */
  preamble: string;
}

type Kind = `heading:${string}` | "num" | "dotted" | "paren-num" | "paren-letter" | "paren-upper" | "paren-roman";

interface Marker {
  kind: Kind;
  /** As shown in the path: "Rule XVI", "4", "12.3", "(a)". */
  step: string;
  /** For the key: "rule-xvi", "4", "a". */
  slug: string;
  /** For letter/roman disambiguation. */
  value?: string;
}

const HEADING_WORDS: Array<[RegExp, string]> = [
  [/^standing\s+orders?(?:\s+no\.?)?/i, "SO"],
  [/^s\.\s?o\.(?:\s+no\.?)?/i, "SO"],
  [/^so(?:\s+no\.?)?(?=\s*\d)/i, "SO"],
  [/^rule/i, "Rule"],
  [/^article/i, "Article"],
  [/^art\./i, "Article"],
  [/^section/i, "Section"],
  [/^sec\./i, "Section"],
  [/^chapter/i, "Chapter"],
  [/^part/i, "Part"],
  [/^title/i, "Title"],
  [/^§§?/, "§"],
];
/** Headings that group rules; a clause's label is taken from the deepest heading that is not one of these. */
const GROUPING = new Set(["Chapter", "Part", "Title"]);

const ROMAN = /^(?=[ivxlc]+$)c{0,3}(xc|xl|l?x{0,3})(ix|iv|v?i{0,3})$/;

function headingAt(line: string): { marker: Marker; rest: string } | null {
  for (const [re, word] of HEADING_WORDS) {
    const m = re.exec(line);
    if (!m) continue;
    const after = line.slice(m[0].length);
    const num = /^\s*([0-9]{1,4}[A-Za-z]?|[IVXLC]{1,8})(?![A-Za-z0-9])/.exec(after);
    if (!num) return null;
    const rest = after.slice(num[0].length);
    // "Section 3 of the Act…" is a sentence, not a heading: after the number comes the end of the line,
    // punctuation, or a capitalised title.
    if (rest.trim() && !/^\s*([.:\u2014\u2013-]|\(|[A-Z"“'‘])/.test(rest)) return null;
    const n = num[1]!;
    const step = word === "§" ? `§${n}` : `${word} ${n}`;
    return { marker: { kind: `heading:${word}`, step, slug: `${word === "§" ? "s" : word.toLowerCase()}-${n.toLowerCase()}` }, rest: rest.replace(/^\s*[.:\u2014\u2013-]*\s*/, "") };
  }
  return null;
}

/** The next sub-clause marker at the start of `s`, or null. */
function markerAt(s: string): { marker: Marker; length: number } | null {
  let m = /^(\d{1,3}(?:\.\d{1,3})+)\.?(?=\s|$)/.exec(s);
  if (m) return { marker: { kind: "dotted", step: m[1]!, slug: m[1]!.replace(/\./g, "-") }, length: m[0].length };
  m = /^(\d{1,3})(?:\.(?!\d)|\)(?=\s))(?:\s*[\u2014\u2013-](?=\s*\())?/.exec(s);
  if (m) return { marker: { kind: m[0].includes(")") ? "paren-num" : "num", step: m[0].includes(")") ? `(${m[1]})` : m[1]!, slug: m[1]! }, length: m[0].length };
  m = /^\((\d{1,3}[A-Za-z]?)\)/.exec(s);
  if (m) return { marker: { kind: "paren-num", step: `(${m[1]})`, slug: m[1]!.toLowerCase() }, length: m[0].length };
  m = /^\(([a-z]{1,3})\)/.exec(s) ?? /^([a-z]{1,2})\)(?=\s)/.exec(s);
  if (m) return { marker: { kind: "paren-letter", step: `(${m[1]})`, slug: m[1]!, value: m[1]! }, length: m[0].length };
  m = /^\(([A-Z]{1,2})\)/.exec(s);
  if (m) return { marker: { kind: "paren-upper", step: `(${m[1]})`, slug: m[1]!.toLowerCase() }, length: m[0].length };
  return null;
}

const nextLetter = (v: string) => (v.length === 1 ? String.fromCharCode(v.charCodeAt(0) + 1) : v.split("").map((c) => String.fromCharCode(c.charCodeAt(0) + 1)).join(""));

/** Clean one line of extracted text: Markdown headings, emphasis and bullets; page numbers dropped (null). */
function cleanLine(raw: string): string | null {
  let s = raw.replace(/\t/g, " ").replace(/\u00a0/g, " ").trim();
  if (/^(page\s+)?\d{1,4}(\s+of\s+\d{1,4})?$/i.test(s)) return null;
  s = s.replace(/^#{1,6}\s+/, "").replace(/^[-*+]\s+(?=\S)/, "");
  s = s.replace(/^(\*\*|__)(.+?)\1/, "$2");
  return s;
}

const endsSentence = (s: string) => /([.:;!?\u2014\u2013"”)]|;\s*(and|or)|,\s*(and|or))\s*$/i.test(s);

function label(path: readonly Marker[]): string {
  let h = -1;
  for (let i = path.length - 1; i >= 0; i--) {
    const k = path[i]!.kind;
    if (k.startsWith("heading:") && !GROUPING.has(k.slice(8))) {
      h = i;
      break;
    }
  }
  if (h < 0) {
    // Only grouping headings above (or none): a "Chapter 2" alone is its own label.
    const lastHeading = path.findLastIndex((m) => m.kind.startsWith("heading:"));
    if (lastHeading === path.length - 1) return path[lastHeading]!.step;
    h = lastHeading;
  }
  const head = h >= 0 ? path[h]!.step : "";
  const below = path.slice(h + 1);
  let out = head;
  below.forEach((m, i) => {
    if (m.kind === "num" || m.kind === "dotted") {
      if (i === 0 && head) out += head.startsWith("Rule") ? `, clause ${m.step}` : `, paragraph ${m.step}`;
      else out += out ? ` ${m.step}` : m.step;
    } else {
      out += m.step;
    }
  });
  return out;
}

/** Split `text` into clauses (see the module comment). */
export function splitClauses(text: string): SplitResult {
  const lines = text.replace(/\r\n?/g, "\n").split("\n");
  const clauses: Clause[] = [];
  const stack: Array<{ marker: Marker; clause: Clause }> = [];
  const preamble: string[] = [];
  const keys = new Map<string, number>();
  let current: Clause | null = null;
  let prevText = "";
  let prevBlank = true;

  const append = (target: string[] | Clause, s: string) => {
    if (!s) return;
    if (Array.isArray(target)) {
      target.push(s);
      return;
    }
    const t = target.text;
    target.text = !t ? s : /[A-Za-z]-$/.test(t) && /^[a-z]/.test(s) ? t.slice(0, -1) + s : `${t} ${s}`;
  };

  const open = (marker: Marker, lineNo: number): Clause => {
    const headingWord = marker.kind.startsWith("heading:");
    let at = stack.findIndex((e) => e.marker.kind === marker.kind);
    // (i) after (h), (v) after (u), (x) after (w): letters, not roman numerals.
    if (marker.kind === "paren-letter" && ROMAN.test(marker.value!)) {
      const letter = stack.find((e) => e.marker.kind === "paren-letter");
      const follows = letter !== undefined && nextLetter(letter.marker.value!) === marker.value;
      const romanOpen = stack.some((e) => e.marker.kind === "paren-roman");
      if (!follows && (romanOpen || marker.value === "i")) {
        marker = { ...marker, kind: "paren-roman" };
        at = stack.findIndex((e) => e.marker.kind === "paren-roman");
      }
    }
    if (at >= 0) stack.length = at;
    else if (headingWord) {
      // A heading word not yet open nests below the grouping headings open (a Rule inside a Chapter);
      // beside any other heading it starts again at that heading's level ("§34" after "SO 42").
      const isGrouping = (k: string) => k.startsWith("heading:") && GROUPING.has(k.slice(8));
      const firstOther = stack.findIndex((e) => !isGrouping(e.marker.kind));
      stack.length = GROUPING.has(marker.kind.slice(8)) ? Math.max(0, stack.findIndex((e) => e.marker.kind.startsWith("heading:"))) : firstOther < 0 ? stack.length : firstOther;
    }
    const path = [...stack.map((e) => e.marker), marker];
    let key = path.map((m) => m.slug).join("/");
    const seen = keys.get(key) ?? 0;
    keys.set(key, seen + 1);
    if (seen > 0) key = `${key}~${seen + 1}`;
    const clause: Clause = { key, label: label(path), path: path.map((m) => m.step), level: stack.length, parent: stack.at(-1)?.clause.key ?? null, title: null, text: "", line: lineNo };
    stack.push({ marker, clause });
    clauses.push(clause);
    if (clauses.length > MAX_CLAUSES) throw new GavelError("too-large", `the document splits into more than ${MAX_CLAUSES} clauses`, { issues: [{ path: "text", message: `more than ${MAX_CLAUSES} clauses` }] });
    return clause;
  };

  /** A short line without closing punctuation: a caption ("Privileged motions"), not a sentence. */
  const captionLike = (s: string) => s.length <= 70 && /^[A-Z"“]/.test(s) && !/[.;:,]$/.test(s) && !markerAt(s);
  let caption: string | null = null;
  let prevWasHeading = false;

  lines.forEach((raw, i) => {
    const s = cleanLine(raw);
    if (s === null) return;
    if (!s) {
      prevBlank = true;
      if (caption !== null) append(current ?? preamble, caption);
      caption = null;
      return;
    }
    const markdownHeading = /^(#|\*\*|__)/.test(raw.trim());
    const atBoundary = prevBlank || prevWasHeading || caption !== null || !prevText || endsSentence(prevText) || captionLike(prevText) || markdownHeading;
    let rest = s;
    let opened = false;
    let first: Clause | null = null;
    const heading = headingAt(rest);
    if (heading && (atBoundary || markdownHeading || captionLike(prevText))) {
      current = first = open(heading.marker, i + 1);
      opened = true;
      rest = heading.rest;
      if (rest && !markerAt(rest)) {
        const cut = /^(.{1,80}?)[.:](?:\s+(?=\S)|\s*$)/.exec(rest);
        if (cut) {
          current.title = cut[1]!.trim();
          rest = rest.slice(cut[0].length).trim();
        } else if (rest.length <= 80 && !/[.;:,]$/.test(rest)) {
          current.title = rest;
          rest = "";
        }
      }
    }
    if (opened || atBoundary) {
      for (let m = markerAt(rest); m; m = markerAt(rest)) {
        current = open(m.marker, i + 1);
        first ??= current;
        opened = true;
        rest = rest.slice(m.length).replace(/^\s*[\u2014\u2013-]?\s*/, "");
      }
    }
    if (opened && caption !== null) {
      // A caption above a clause is its title (or, under a heading with no title yet, the heading's).
      if (first!.title === null) first!.title = caption;
      else append(first!, caption);
      caption = null;
    } else if (caption !== null) {
      append(current ?? preamble, caption);
      caption = null;
    }
    if (opened && current !== null && !current.text && current.title === null && captionLike(rest) && !stack.at(-1)!.marker.kind.startsWith("paren")) {
      // "33. Calling of amendments at end of debate": the words after the number are the clause's title.
      current.title = rest;
      rest = "";
    } else if (!opened && current !== null && !current.text && current.title === null && prevWasHeading && captionLike(rest)) {
      current.title = rest;
      rest = "";
    } else if (!opened && captionLike(rest) && atBoundary) {
      caption = rest;
      rest = "";
    }
    append(current ?? preamble, rest);
    prevWasHeading = opened && !rest;
    prevText = rest || s;
    prevBlank = false;
  });
  if (caption !== null) append(current ?? preamble, caption);
  return { clauses, preamble: preamble.join("\n") };
}
