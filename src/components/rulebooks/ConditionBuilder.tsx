/**
 * A structured editor for a json-rules-engine condition tree: all / any / not groups and leaves.
 * Leaves are chosen in the clerk's words (GuidedLeaf, from fact-descriptions.ts: the same
 * description the rule sentences use); with `names` on, or for a condition no description covers,
 * a leaf shows the fact, path, operator and JSON value as the file names them.
 */
import { useState } from "react";
import { describeField, factDescriptions, fieldKey, operatorsFor, pathOf, type FieldDescription } from "../../lib/procedure/fact-descriptions.ts";
import { MOTION_CLASSES } from "../../lib/procedure/rulebook-schema.ts";
import { BUILTIN_OPERATORS, CUSTOM_OPERATORS, SCOPE_FACTS, type RuleScope } from "../../lib/procedure/rule-vocabulary.ts";
import { FieldMessages, type IssueLookup } from "../shared/fields.tsx";

type Node = Record<string, unknown>;
const OPERATORS = [...BUILTIN_OPERATORS, ...Object.keys(CUSTOM_OPERATORS), ...Object.keys(CUSTOM_OPERATORS).map((o) => `not:${o}`), "not:contains", "someValue:in"];

const isObj = (v: unknown): v is Node => v !== null && typeof v === "object" && !Array.isArray(v);
const groupKey = (n: Node): "all" | "any" | "not" | null => ("all" in n ? "all" : "any" in n ? "any" : "not" in n ? "not" : null);
const fid = (path: string) => `f-${path.replace(/[^A-Za-z0-9_-]/g, "_")}`;

interface Props {
  node: unknown;
  path: string;
  scope: RuleScope;
  at: IssueLookup;
  readOnly: boolean;
  onChange: (n: Node) => void;
  onRemove?: () => void;
  depth?: number;
  /** Show the JSON names (fact, path, operator, value) instead of the clerk's words. */
  names?: boolean;
  /** The catalogue, for choosing motions by name. */
  motions?: readonly { id: string; name: string }[];
}

const cap = (s: string) => s.replace(/^./, (c) => c.toUpperCase());

/** A fresh leaf for a field: the first operator its kind allows and a value of the right type. */
export function freshLeaf(fact: string, key: string, field: FieldDescription, motions: readonly { id: string }[]): Node {
  const base: Node = { fact, ...(pathOf(key) ? { path: pathOf(key) } : {}) };
  switch (field.kind) {
    case "boolean":
      return { ...base, operator: "equal", value: true };
    case "number":
      return { ...base, operator: "equal", value: 0 };
    case "motion":
      return { ...base, operator: "equal", value: motions[0]?.id ?? "" };
    case "class":
      return { ...base, operator: "equal", value: "privileged" };
    case "enum":
      return { ...base, operator: "equal", value: Object.keys(field.values ?? {})[0] ?? "" };
    case "list":
    case "motion-list":
      return field.empty ? { ...base, operator: "isEmpty", value: false } : { ...base, operator: "contains", value: "" };
    case "time":
      return { ...base, operator: "laterThan", value: { fact: "filing", path: "$.deadlineMs" } };
    default:
      return { ...base, operator: "equal", value: "" };
  }
}

/** A leaf in the clerk's words: what is compared, how, and with what. */
function GuidedLeaf({ node, path, scope, at, readOnly, onChange, onRemove, motions = [] }: Props & { node: Node; field: FieldDescription }) {
  const field = describeField(node.fact, node.path)!;
  const key = fieldKey(node.path) ?? "";
  const groups = factDescriptions(scope);
  const op = String(node.operator);
  const v = node.value;
  const isRef = v !== null && typeof v === "object" && !Array.isArray(v) && "fact" in (v as Node);
  const listValue = op === "in" || op === "notIn";
  const choices: { value: string; label: string }[] = [];
  // Yes/no fields and lists that may be empty read as one clause each way.
  const stateOps: { op: string; value: unknown; label: string }[] =
    field.kind === "boolean" && field.yes && field.no
      ? [{ op: "equal", value: true, label: field.yes }, { op: "equal", value: false, label: field.no }, { op: "notEqual", value: true, label: `${field.no} (or not known)` }, { op: "notEqual", value: false, label: `${field.yes} (or not known)` }]
      : field.empty && field.nonEmpty
        ? [{ op: "isEmpty", value: true, label: field.empty }, { op: "isEmpty", value: false, label: field.nonEmpty }]
        : [];
  const special = Object.entries(field.special ?? {}).map(([k, label]) => ({ op: k.split(":")[0], value: Number(k.split(":")[1]), label }));
  for (const s of [...stateOps, ...special]) choices.push({ value: `state:${s.op}:${JSON.stringify(s.value)}`, label: s.label });
  const stateNow = `state:${op}:${JSON.stringify(v)}`;
  const inState = choices.some((c) => c.value === stateNow);
  const ops = field.kind === "boolean" ? [] : operatorsFor(field.kind).filter((o) => o.op !== "isEmpty");
  for (const o of ops) choices.push({ value: `op:${o.op}`, label: o.words });
  const howValue = inState ? stateNow : `op:${op}`;
  if (!choices.some((c) => c.value === howValue)) choices.push({ value: howValue, label: op });
  const numberFields = groups.flatMap((d) => Object.entries(d.fields).filter(([, f]) => f.kind === field.kind && (f.kind === "number" || f.kind === "time" || f.kind === "list" || f.kind === "motion-list")).map(([k, f]) => ({ value: `${d.fact}|${k}`, label: f.label })));
  const setHow = (h: string) => {
    if (h.startsWith("state:")) {
      const rest = h.slice("state:".length);
      const cut = rest.indexOf(":");
      onChange({ ...node, operator: rest.slice(0, cut), value: JSON.parse(rest.slice(cut + 1)) });
    } else {
      const o = h.slice(3);
      const wasList = Array.isArray(v);
      const wantsList = o === "in" || o === "notIn";
      onChange({ ...node, operator: o, value: wantsList && !wasList ? (v === undefined || isRef ? [] : [v]) : !wantsList && wasList ? ((v as unknown[])[0] ?? "") : v });
    }
  };
  const valueOptions: { value: string; label: string }[] | null =
    field.kind === "motion" ? motions.map((m) => ({ value: m.id, label: m.name })) : field.kind === "class" ? MOTION_CLASSES.map((c) => ({ value: c, label: c === "restorative" ? "bringing a question back" : c })) : field.values ? Object.entries(field.values).map(([value, label]) => ({ value, label })) : null;
  const id = (s: string) => fid(`${path}.${s}`);
  return (
    <div className="flex flex-wrap items-start gap-2 rounded-md border border-rule bg-white p-2" data-condition-path={path}>
      <div className="min-w-48 flex-1">
        <label htmlFor={id("what")} className="text-xs font-semibold text-ink-soft">What</label>
        <select
          id={id("what")}
          className="gw-input text-sm"
          disabled={readOnly}
          value={`${String(node.fact)}|${key}`}
          onChange={(e) => {
            const [fact, k] = e.target.value.split("|");
            const f = describeField(fact, pathOf(k));
            if (f) onChange(freshLeaf(fact, k, f, motions));
          }}
        >
          {groups.map((d) => (
            <optgroup key={d.fact} label={d.group}>
              {Object.entries(d.fields).map(([k, f]) => <option key={k} value={`${d.fact}|${k}`}>{cap(f.label)}</option>)}
            </optgroup>
          ))}
        </select>
      </div>
      <div className="min-w-40 flex-1">
        <label htmlFor={id("how")} className="text-xs font-semibold text-ink-soft">{inState ? "Holds when" : "How"}</label>
        <select id={id("how")} className="gw-input text-sm" disabled={readOnly} value={howValue} onChange={(e) => setHow(e.target.value)} aria-invalid={at(`${path}.operator`).length > 0 || undefined}>
          {choices.map((c) => <option key={c.value} value={c.value}>{c.label}</option>)}
        </select>
        <FieldMessages path={`${path}.operator`} at={at} />
      </div>
      {!inState && (
        <div className="min-w-40 flex-1">
          <label htmlFor={id("value")} className="text-xs font-semibold text-ink-soft">{listValue ? "Any of" : "Compared with"}</label>
          {numberFields.length > 0 && (field.kind === "number" || field.kind === "time" || isRef) ? (
            <div className="flex gap-1">
              <select
                id={id("value")}
                className="gw-input text-sm"
                disabled={readOnly}
                value={isRef ? `${String((v as Node).fact)}|${fieldKey((v as Node).path) ?? ""}` : "literal"}
                onChange={(e) => {
                  if (e.target.value === "literal") onChange({ ...node, value: 0 });
                  else {
                    const [fact, k] = e.target.value.split("|");
                    onChange({ ...node, value: { fact, ...(pathOf(k) ? { path: pathOf(k) } : {}) } });
                  }
                }}
              >
                {field.kind === "number" && <option value="literal">a number</option>}
                {numberFields.filter((f) => f.value !== `${String(node.fact)}|${key}`).map((f) => <option key={f.value} value={f.value}>{cap(f.label)}</option>)}
              </select>
              {!isRef && field.kind === "number" && <input aria-label="Number" type="number" className="gw-input w-24 text-sm" disabled={readOnly} value={typeof v === "number" ? v : ""} onChange={(e) => onChange({ ...node, value: e.target.value === "" ? null : Number(e.target.value) })} />}
            </div>
          ) : valueOptions ? (
            listValue ? (
              <select id={id("value")} multiple size={Math.min(6, valueOptions.length)} className="gw-input text-sm" disabled={readOnly} value={Array.isArray(v) ? (v as string[]) : []} onChange={(e) => onChange({ ...node, value: [...e.target.selectedOptions].map((o) => o.value) })}>
                {valueOptions.map((o) => <option key={o.value} value={o.value}>{o.label}</option>)}
              </select>
            ) : (
              <select id={id("value")} className="gw-input text-sm" disabled={readOnly} value={typeof v === "string" ? v : ""} onChange={(e) => onChange({ ...node, value: e.target.value })}>
                {typeof v === "string" && !valueOptions.some((o) => o.value === v) && <option value={v}>{v || "—"}</option>}
                {valueOptions.map((o) => <option key={o.value} value={o.value}>{o.label}</option>)}
              </select>
            )
          ) : (
            <input id={id("value")} className="gw-input text-sm" disabled={readOnly} value={typeof v === "string" || typeof v === "number" ? String(v) : ""} onChange={(e) => onChange({ ...node, value: e.target.value })} />
          )}
          <FieldMessages path={`${path}.value`} at={at} />
        </div>
      )}
      {!readOnly && onRemove && <button type="button" className="gw-btn-quiet mt-5" onClick={onRemove} aria-label={`Remove this condition (${cap(field.label)})`}>Remove</button>}
      <FieldMessages path={`${path}.fact`} at={at} />
      <FieldMessages path={`${path}.path`} at={at} />
      <FieldMessages path={path} at={at} />
    </div>
  );
}

function ValueInput({ value, path, at, readOnly, onChange }: { value: unknown; path: string; at: IssueLookup; readOnly: boolean; onChange: (v: unknown) => void }) {
  const [text, setText] = useState(() => JSON.stringify(value ?? null));
  return (
    <div className="min-w-40 flex-1">
      <label htmlFor={fid(path)} className="text-xs font-semibold text-ink-soft">Value (JSON)</label>
      <input
        id={fid(path)}
        className="gw-input font-mono text-sm"
        value={text}
        disabled={readOnly}
        aria-invalid={at(path).length > 0 || undefined}
        onChange={(e) => {
          setText(e.target.value);
          try {
            onChange(JSON.parse(e.target.value));
          } catch {
            // Plain words are taken as text, so a clerk can type main instead of "main".
            onChange(e.target.value);
          }
        }}
      />
      <FieldMessages path={path} at={at} />
    </div>
  );
}

function Leaf({ node, path, scope, at, readOnly, onChange, onRemove }: Props & { node: Node }) {
  const facts = SCOPE_FACTS[scope];
  const set = (k: string, v: unknown) => {
    const next = { ...node };
    if (v === "" || v === undefined) delete next[k];
    else next[k] = v;
    onChange(next);
  };
  return (
    <div className="flex flex-wrap items-start gap-2 rounded-md border border-rule bg-white p-2" data-condition-path={path}>
      <div className="w-40">
        <label htmlFor={fid(`${path}.fact`)} className="text-xs font-semibold text-ink-soft">Fact</label>
        <select id={fid(`${path}.fact`)} className="gw-input text-sm" disabled={readOnly} value={typeof node.fact === "string" ? node.fact : ""} onChange={(e) => set("fact", e.target.value)} aria-invalid={at(`${path}.fact`).length > 0 || undefined}>
          {typeof node.fact === "string" && !facts.includes(node.fact) && <option value={node.fact}>{node.fact} (unknown)</option>}
          {facts.map((f) => <option key={f} value={f}>{f}</option>)}
        </select>
        <FieldMessages path={`${path}.fact`} at={at} />
      </div>
      <div className="w-32">
        <label htmlFor={fid(`${path}.path`)} className="text-xs font-semibold text-ink-soft">Path</label>
        <input id={fid(`${path}.path`)} className="gw-input font-mono text-sm" placeholder="$.rank" disabled={readOnly} value={typeof node.path === "string" ? node.path : ""} onChange={(e) => set("path", e.target.value)} aria-invalid={at(`${path}.path`).length > 0 || undefined} />
        <FieldMessages path={`${path}.path`} at={at} />
      </div>
      <div className="w-44">
        <label htmlFor={fid(`${path}.operator`)} className="text-xs font-semibold text-ink-soft">Operator</label>
        <input id={fid(`${path}.operator`)} list="gw-operators" className="gw-input font-mono text-sm" disabled={readOnly} value={typeof node.operator === "string" ? node.operator : ""} onChange={(e) => set("operator", e.target.value)} aria-invalid={at(`${path}.operator`).length > 0 || undefined} />
        <FieldMessages path={`${path}.operator`} at={at} />
      </div>
      <ValueInput value={node.value} path={`${path}.value`} at={at} readOnly={readOnly} onChange={(v) => onChange({ ...node, value: v })} />
      {!readOnly && onRemove && (
        <button type="button" className="gw-btn-quiet mt-5" onClick={onRemove} aria-label={`Remove condition ${path}`}>Remove</button>
      )}
      <FieldMessages path={path} at={at} />
    </div>
  );
}

/** Rendered once per page: the operator suggestions every operator field offers. */
export function OperatorList() {
  return (
    <datalist id="gw-operators">
      {OPERATORS.map((o) => <option key={o} value={o} />)}
    </datalist>
  );
}

export default function ConditionBuilder(props: Props) {
  const { node, path, scope, at, readOnly, onChange, onRemove, depth = 0, names = false, motions = [] } = props;
  if (!isObj(node)) return <p className="gw-error">This condition is not an object; fix it in the raw JSON view.</p>;
  const k = groupKey(node);
  if (!k) {
    const field = describeField(node.fact, node.path);
    const op = typeof node.operator === "string" ? node.operator : "";
    // The guided form covers what the description offers; anything else keeps the JSON names.
    const guided =
      field !== null &&
      (field.kind === "boolean"
        ? (op === "equal" || op === "notEqual") && typeof node.value === "boolean"
        : operatorsFor(field.kind).some((o) => o.op === op) || Object.keys(field.special ?? {}).some((s) => s.startsWith(`${op}:`)));
    if (!names && guided) return <GuidedLeaf {...props} node={node} field={field} />;
    return <Leaf {...props} node={node} />;
  }
  const children: unknown[] = k === "not" ? [node.not] : Array.isArray(node[k]) ? (node[k] as unknown[]) : [];
  const setChildren = (list: unknown[], key = k) => {
    const next: Node = { ...node };
    delete next.all;
    delete next.any;
    delete next.not;
    if (key === "not") next.not = list[0] ?? { fact: SCOPE_FACTS[scope][0], operator: "equal", value: true };
    else next[key] = list;
    onChange(next);
  };
  const blankLeaf = scope === "motion" ? freshLeaf("motion", "id", describeField("motion", "$.id")!, motions) : freshLeaf("amendment", "form", describeField("amendment", "$.form")!, motions);
  return (
    <div className={`space-y-2 rounded-md border-l-4 p-2 ${depth % 2 ? "border-brass bg-vellum" : "border-chamber bg-chamber-tint/40"}`} data-condition-path={path}>
      <div className="flex flex-wrap items-center gap-2">
        <label htmlFor={fid(`${path}.kind`)} className="text-xs font-semibold text-ink-soft">Group</label>
        <select id={fid(`${path}.kind`)} className="rounded-md border border-ink-soft/40 bg-white px-2 py-1 text-sm" disabled={readOnly} value={k} onChange={(e) => setChildren(e.target.value === "not" ? children.slice(0, 1) : children, e.target.value as "all" | "any" | "not")}>
          <option value="all">all of these hold</option>
          <option value="any">any of these holds</option>
          <option value="not">this does not hold</option>
        </select>
        {!readOnly && k !== "not" && (
          <>
            <button type="button" className="gw-btn-quiet" onClick={() => setChildren([...children, blankLeaf])}>+ Condition</button>
            <button type="button" className="gw-btn-quiet" onClick={() => setChildren([...children, { all: [blankLeaf] }])}>+ Group</button>
          </>
        )}
        {!readOnly && onRemove && <button type="button" className="gw-btn-quiet" onClick={onRemove}>Remove group</button>}
      </div>
      <FieldMessages path={path} at={at} />
      <FieldMessages path={`${path}.${k}`} at={at} />
      {children.map((c, i) => {
        const childPath = k === "not" ? `${path}.not` : `${path}.${k}.${i}`;
        return (
          <ConditionBuilder
            key={i}
            node={c}
            path={childPath}
            scope={scope}
            at={at}
            readOnly={readOnly}
            depth={depth + 1}
            names={names}
            motions={motions}
            onChange={(n) => setChildren(children.map((x, j) => (j === i ? n : x)))}
            onRemove={k === "not" || children.length <= 1 ? undefined : () => setChildren(children.filter((_, j) => j !== i))}
          />
        );
      })}
    </div>
  );
}
