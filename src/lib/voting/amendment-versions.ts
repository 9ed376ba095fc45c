/**
 * The alternatives of a measure under an amendment tree (DOMAIN §1–2; Ordeshook & Schwartz 1987,
 * APSR 81:179–199): the status quo Q, the measure, and every version reachable by adopting
 * amendments consistently with the tree.
 *  - A second-degree amendment is only ever part of a version together with its parent.
 *  - Two mutually exclusive amendments (amendmentsConflict: they change the same text) never combine;
 *    amendments to different text combine.
 *  - A substitute replaces the text it targets: once it is adopted, the perfecting amendments of that
 *    text (and their own amendments) drop out of the version. A perfecting amendment and a substitute
 *    for the same text are therefore not "exclusive" — the perfecting amendment may be adopted first,
 *    and the substitute then meets the perfected text — but no version contains both.
 *    See docs/decisions/0003-amendment-trees-as-voting-trees.md.
 * Version ids: `Q`, the measure id, and `<measure>+<adopted amendment ids in tree order>`; tree order is
 * the first-degree amendments in input order, each followed by what amends it (depth first, in input
 * order).
 *
 * A substitute whose target is a first-degree amendment is the House's "further amendment by way of
 * substitute, to which one amendment may be offered, but which shall not be voted on until the original
 * matter is perfected" (House Rule XIX as quoted in Robert's Rules of Order Revised 1915, §33 p. 135 fn. 1;
 * now Rule XVI cl. 6). CRS Report 98-613: "Such a substitute is treated as a first-degree amendment …
 * Like the original first-degree amendment, this one also is subject to second-degree amendments." It
 * takes that amendment's substitute slot (degree 1, `substituteFor`), and an amendment to it is of the
 * second degree. Adopting it replaces the amendment's text as perfected (the amendments to that text drop
 * out); the question is then on the amendment as amended by the substitute (version `B+A+S`).
 * Any other amendment of an amendment of an amendment is of the third degree and out of order (Robert's
 * Rules of Order Revised 1915, §33 p. 135: "An amendment of the third degree would be too complicated and
 * is not in order").
 */
import { GavelError, parseWith } from "../errors.ts";
import { amendmentSchema, measureSchema, type Amendment, type Measure } from "../amendments/case-schema.ts";
import { amendmentsConflict } from "../amendments/conflicts.ts";
import { z } from "zod";

export const MAX_TREE_AMENDMENTS = 16;
export const MAX_VERSIONS = 4096;
export const STATUS_QUO = "Q";

const ACTIVE = new Set(["draft", "filed", "pending"]);
const SUBSTITUTE_FORMS = new Set(["substitute", "in-nature-of-substitute"]);

export interface AmendmentTreeModel {
  measure: Measure;
  /** Pending amendments in tree order. */
  amendments: Amendment[];
  /** Index of each amendment in the input array (for error paths). */
  inputIndex: number[];
  parent: number[];
  /** ancestors[a] bitmask: the amendments a amends, directly or through its parent. */
  ancestors: number[];
  /** descendants[a] bitmask: the amendments that amend a, directly or not. */
  descendants: number[];
  /** Degree for voting: 1 for amendments of the measure or its sections and for a substitute for a first-degree amendment; 2 otherwise. */
  degree: Array<1 | 2>;
  /** For a substitute for a first-degree amendment: that amendment's index (its parent); −1 otherwise. */
  substituteFor: number[];
  isSubstitute: boolean[];
  /** exclusive[a] bitmask: amendments that cannot be adopted together with a. */
  exclusive: number[];
  /** supersedes[s] bitmask: amendments whose text the substitute s replaces (with their own amendments). */
  supersedes: number[];
  /** Alternatives: Q, the measure, then versions by number of amendments and tree order. */
  versions: Array<{ id: string; amendments: string[] }>;
  versionIndex: Map<string, number>;
  /** Effective amendments (bitmask) of an adopted set, memoised. */
  effective(adopted: number): number;
  /** Alternative index of the version an adopted set produces. */
  versionOf(adopted: number): number;
}

export const treeInputSchema = z.object({ measure: measureSchema, amendments: z.array(amendmentSchema).max(500).default([]) });

function bad(path: string, message: string, code: "invalid-input" | "unprocessable" = "invalid-input"): never {
  throw new GavelError(code, `${path}: ${message}`, { issues: [{ path, message }] });
}

export function amendmentTreeModel(raw: { measure: unknown; amendments?: unknown }, pathPrefix = ""): AmendmentTreeModel {
  const p = (s: string) => (pathPrefix ? `${pathPrefix}.${s}` : s);
  const { measure, amendments: all } = parseWith(treeInputSchema, raw, "amendment tree", pathPrefix || undefined);
  const sections = new Map(measure.sections.map((s, i) => [s.id, i]));
  const byId = new Map<string, number>();
  all.forEach((a, i) => {
    if (byId.has(a.id) || a.id === measure.id || sections.has(a.id) || a.id === STATUS_QUO) bad(p(`amendments.${i}.id`), `duplicate id "${a.id}"`);
    byId.set(a.id, i);
  });
  const activeIdx = all.map((_, i) => i).filter((i) => ACTIVE.has(all[i].status));
  const isActive = new Set(activeIdx);
  // Degrees from targets; roots in input order, each followed by what amends it (depth first).
  const roots: number[] = [];
  const children = new Map<number, number[]>();
  const isRootTarget = (t: string) => t === measure.id || sections.has(t);
  /** A substitute whose target is a first-degree amendment (its own target the measure or a section). */
  const slotSubstitute = (i: number) => {
    if (!SUBSTITUTE_FORMS.has(all[i].form) || isRootTarget(all[i].target)) return false;
    const t = byId.get(all[i].target);
    return t !== undefined && isActive.has(t) && isRootTarget(all[t].target);
  };
  // Every target first (a missing one is reported where it is, not as a degree error further down).
  for (const i of activeIdx) {
    const a = all[i];
    if (isRootTarget(a.target)) continue;
    const t = byId.get(a.target);
    if (t === undefined || !isActive.has(t)) bad(p(`amendments.${i}.target`), `"${a.target}" is neither the measure, one of its sections, nor a pending amendment`);
    if (t === i) bad(p(`amendments.${i}.target`), "an amendment cannot amend itself", "unprocessable");
  }
  for (const i of activeIdx) {
    const a = all[i];
    if (isRootTarget(a.target)) roots.push(i);
    else {
      const t = byId.get(a.target)!;
      // Second degree: the target amends the measure or a section, or is a substitute for a first-degree amendment.
      if (!isRootTarget(all[t].target) && !slotSubstitute(t)) bad(p(`amendments.${i}.target`), "a third-degree amendment is out of order", "unprocessable");
      children.set(t, [...(children.get(t) ?? []), i]);
    }
  }
  const order: number[] = [];
  const place = (i: number) => {
    order.push(i);
    for (const c of children.get(i) ?? []) place(c);
  };
  for (const r of roots) place(r);
  if (order.length > MAX_TREE_AMENDMENTS) throw new GavelError("limit-exceeded", `at most ${MAX_TREE_AMENDMENTS} pending amendments can be analysed together; got ${order.length}`, { issues: [{ path: p("amendments"), message: "too many pending amendments" }] });
  const k = order.length;
  const pos = new Map(order.map((i, j) => [i, j]));
  const amendments = order.map((i) => all[i]);
  const parent = order.map((i) => (roots.includes(i) ? -1 : pos.get(byId.get(all[i].target)!)!));
  const substituteFor = order.map((i, j) => (!roots.includes(i) && slotSubstitute(i) ? parent[j] : -1));
  const degree = order.map((_, j) => (parent[j] < 0 || substituteFor[j] >= 0 ? 1 : 2) as 1 | 2);
  const ancestors = new Array<number>(k).fill(0);
  for (let a = 0; a < k; a++) if (parent[a] >= 0) ancestors[a] = ancestors[parent[a]] | (1 << parent[a]);
  const descendants = new Array<number>(k).fill(0);
  for (let a = 0; a < k; a++) for (let m = ancestors[a]; m !== 0; m &= m - 1) descendants[31 - Math.clz32(m & -m)] |= 1 << a;
  const isSubstitute = amendments.map((a) => SUBSTITUTE_FORMS.has(a.form));
  // Text a (non-substitute) amends lies within what substitute s replaces.
  const within = (a: Amendment, s: Amendment) => a.target === s.target || (s.target === measure.id && sections.has(a.target));
  const supersedes = new Array<number>(k).fill(0);
  for (let s = 0; s < k; s++) {
    if (!isSubstitute[s]) continue;
    for (let a = 0; a < k; a++) if (a !== s && !isSubstitute[a] && within(amendments[a], amendments[s])) supersedes[s] |= 1 << a;
    for (let a = 0; a < k; a++) if (a !== s && isSubstitute[a] && amendments[s].target === measure.id && sections.has(amendments[a].target)) supersedes[s] |= 1 << a;
    for (let a = 0; a < k; a++) if (parent[a] >= 0 && supersedes[s] & (1 << parent[a])) supersedes[s] |= 1 << a;
  }
  const exclusive = new Array<number>(k).fill(0);
  for (let a = 0; a < k; a++)
    for (let b = 0; b < k; b++)
      if (a !== b && !(supersedes[a] & (1 << b)) && !(supersedes[b] & (1 << a)) && amendmentsConflict(amendments[a], amendments[b])) exclusive[a] |= 1 << b;
  // Outer substitutes first, so a substitute replaced by a wider one removes nothing.
  const subsOuterFirst = [...Array(k).keys()].filter((s) => isSubstitute[s]).sort((x, y) => (parent[x] >= 0 ? 1 : 0) - (parent[y] >= 0 ? 1 : 0) || (amendments[x].target === measure.id ? 0 : 1) - (amendments[y].target === measure.id ? 0 : 1));
  const effMemo = new Map<number, number>();
  const effective = (adopted: number): number => {
    let e = effMemo.get(adopted);
    if (e !== undefined) return e;
    e = 0;
    // Exclusive pairs never arise from a vote (the later one falls); first in tree order wins for robustness.
    for (let a = 0; a < k; a++) if (adopted & (1 << a) && (parent[a] < 0 || e & (1 << parent[a])) && !(exclusive[a] & e)) e |= 1 << a;
    for (const s of subsOuterFirst) if (e & (1 << s)) e &= ~supersedes[s];
    effMemo.set(adopted, e);
    return e;
  };
  const idOf = (eff: number) => [measure.id, ...amendments.filter((_, a) => eff & (1 << a)).map((a) => a.id)].join("+");
  // Consistent sets: each amendment with its parent, none exclusive, none superseded.
  const sets: number[] = [];
  const grow = (a: number, set: number) => {
    if (sets.length > MAX_VERSIONS) throw new GavelError("limit-exceeded", `the tree yields more than ${MAX_VERSIONS} versions`, { issues: [{ path: p("amendments"), message: "too many versions" }] });
    if (a === k) return void sets.push(set);
    grow(a + 1, set);
    const ok = (parent[a] < 0 || set & (1 << parent[a])) && !(exclusive[a] & set) && ![...Array(a).keys()].some((s) => set & (1 << s) && (supersedes[s] & (1 << a) || supersedes[a] & (1 << s)));
    if (ok) grow(a + 1, set | (1 << a));
  };
  grow(0, 0);
  const popcount = (x: number) => {
    let c = 0;
    for (; x; x &= x - 1) c++;
    return c;
  };
  sets.sort((x, y) => popcount(x) - popcount(y) || lexTree(x, y, k));
  const versions = [{ id: STATUS_QUO, amendments: [] as string[] }, ...sets.map((s) => ({ id: idOf(s), amendments: amendments.filter((_, a) => s & (1 << a)).map((a) => a.id) }))];
  const versionIndex = new Map(versions.map((v, i) => [v.id, i]));
  const versionOf = (adopted: number) => versionIndex.get(idOf(effective(adopted)))!;
  return { measure, amendments, inputIndex: order, parent, ancestors, descendants, degree, substituteFor, isSubstitute, exclusive, supersedes, versions, versionIndex, effective, versionOf };
}

/** Compare two sets by their members in tree order (first differing member decides). */
function lexTree(x: number, y: number, k: number): number {
  for (let a = 0; a < k; a++) {
    const bx = x & (1 << a);
    const by = y & (1 << a);
    if (bx !== by) return bx ? -1 : 1;
  }
  return 0;
}
