/**
 * Split a measure's plain text (typed in, or extracted from an upload) into sections.
 * Pure. A section starts at a Markdown heading ("## Section 2 — Lamps") or a line opening
 * with "Section N" / "Sec. N" / "§ N"; a line "Subjects: lighting, harbour" inside a section
 * gives its subject tags. A leading "# Title" is the measure's title. Text without headings
 * is one section. Line numbers count the section's non-blank lines (common drafting practice,
 * no source).
 */
import type { StoredSection } from "../db/schema/measures.ts";

const HEADING = /^\s*(?:#{1,6}\s+(.+?)\s*#*\s*|((?:section|sec\.|§)\s*\d+[A-Za-z]?\b.*?))\s*$/i;
const SUBJECTS = /^\s*subjects?\s*:\s*(.*)$/i;
const MAX_SECTIONS = 2000;

export interface ParsedMeasureText {
  title: string | null;
  sections: StoredSection[];
}

export function subjectList(s: string): string[] {
  return [...new Set(s.split(/[,;]/).map((x) => x.trim().toLowerCase()).filter((x) => x.length > 0 && x.length <= 80))].slice(0, 50);
}

export function countLines(text: string): number {
  return text.split(/\r?\n/).filter((l) => l.trim().length > 0).length;
}

export function parseMeasureText(input: string): ParsedMeasureText {
  const lines = input.replace(/\r\n?/g, "\n").split("\n");
  let title: string | null = null;
  const drafts: Array<{ heading: string | null; body: string[]; subjects: string[] }> = [];
  let current: (typeof drafts)[number] | null = null;
  for (const line of lines) {
    const h = HEADING.exec(line);
    if (h) {
      const isTitle = /^\s*#\s/.test(line) && !/^(section|sec\.|§)/i.test(h[1] ?? "");
      if (isTitle && title === null && drafts.length === 0) {
        title = (h[1] ?? "").trim();
        continue;
      }
      current = { heading: (h[1] ?? h[2] ?? "").trim(), body: [], subjects: [] };
      drafts.push(current);
      continue;
    }
    const s = SUBJECTS.exec(line);
    if (s && current) {
      current.subjects.push(...subjectList(s[1]));
      continue;
    }
    if (!current) {
      if (line.trim() === "") continue;
      current = { heading: null, body: [], subjects: [] };
      drafts.push(current);
    }
    current.body.push(line);
  }
  const sections = drafts.slice(0, MAX_SECTIONS).map((d, i): StoredSection => {
    const text = d.body.join("\n").trim();
    return { id: `s${i + 1}`, ...(d.heading ? { heading: d.heading.slice(0, 500) } : {}), text, subjects: [...new Set(d.subjects)], lines: countLines(text), status: "open" };
  });
  return { title, sections };
}
