/**
 * Random amendment trees for property tests (fast-check): first-degree amendments to sections (line ranges,
 * sometimes overlapping) or substitutes for a section or the whole measure; second-degree amendments to them;
 * substitutes for a first-degree amendment (the House's substitute slot) and amendments to those.
 * The measure is `B` with sections s1–s3.
 */
import fc from "fast-check";

export interface TreeAmendment {
  id: string;
  target: string;
  form: "insert" | "strike" | "strike-and-insert" | "substitute";
  lines?: [number, number];
}

const step = fc.record({
  kind: fc.constantFrom("section", "section", "section-substitute", "measure-substitute", "second", "second", "slot-substitute", "slot-second"),
  pick: fc.nat(1000),
  section: fc.nat(2),
  line: fc.integer({ min: 1, max: 8 }),
  len: fc.nat(2),
  form: fc.constantFrom("insert", "strike", "strike-and-insert"),
});

export function randomTree(min: number, max: number): fc.Arbitrary<TreeAmendment[]> {
  return fc.array(step, { minLength: min, maxLength: max }).map((steps) => {
    const out: TreeAmendment[] = [];
    const firstDegree: string[] = [];
    const slotSubs: string[] = [];
    steps.forEach((s, i) => {
      const id = `a${i}`;
      const root = (): TreeAmendment => {
        firstDegree.push(id);
        return { id, target: `s${s.section + 1}`, form: s.form as TreeAmendment["form"], lines: [s.line, s.line + s.len] };
      };
      let a: TreeAmendment;
      if (s.kind === "section-substitute") {
        a = { id, target: `s${s.section + 1}`, form: "substitute" };
        firstDegree.push(id);
      }
      else if (s.kind === "measure-substitute") {
        a = { id, target: "B", form: "substitute" };
        firstDegree.push(id);
      }
      else if (s.kind === "second" && firstDegree.length) a = { id, target: firstDegree[s.pick % firstDegree.length], form: s.form as TreeAmendment["form"] };
      else if (s.kind === "slot-substitute" && firstDegree.length) {
        a = { id, target: firstDegree[s.pick % firstDegree.length], form: "substitute" };
        slotSubs.push(id);
      }
      else if (s.kind === "slot-second" && slotSubs.length) a = { id, target: slotSubs[s.pick % slotSubs.length], form: s.form as TreeAmendment["form"] };
      else a = root();
      out.push(a);
    });
    return out;
  });
}
