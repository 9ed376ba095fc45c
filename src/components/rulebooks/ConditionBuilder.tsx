/** A structured editor for a json-rules-engine condition tree: all / any / not groups and fact-operator-value leaves. */
import { useState } from "react";
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
  const { node, path, scope, at, readOnly, onChange, onRemove, depth = 0 } = props;
  if (!isObj(node)) return <p className="gw-error">This condition is not an object; fix it in the raw JSON view.</p>;
  const k = groupKey(node);
  if (!k) return <Leaf {...props} node={node} />;
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
  const blankLeaf = { fact: SCOPE_FACTS[scope][0], path: "$.id", operator: "equal", value: "" };
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
            onChange={(n) => setChildren(children.map((x, j) => (j === i ? n : x)))}
            onRemove={k === "not" || children.length <= 1 ? undefined : () => setChildren(children.filter((_, j) => j !== i))}
          />
        );
      })}
    </div>
  );
}
