import { Handle, Position, type NodeProps, type Node } from "@xyflow/react";
import { formLabel, statusLabel, type FindingView, type TreeNodeView } from "../../lib/measures/measure-schemas.ts";
import { NODE_SIZE } from "./layout.ts";

export interface TreeNodeData extends Record<string, unknown> {
  node: TreeNodeView;
  findings: FindingView[];
  selected: boolean;
}
export type TreeFlowNode = Node<TreeNodeData, "tree">;

/** Degree colours of our own legend: teal for the first degree, brass for the second, red beyond the limit. */
export const DEGREE_STYLE: Record<string, { bar: string; label: string }> = {
  "1": { bar: "bg-chamber", label: "First degree" },
  "2": { bar: "bg-brass", label: "Second degree" },
  high: { bar: "bg-verdict-bar", label: "Third degree or more" },
  none: { bar: "bg-ink-soft", label: "Degree unknown (cycle or missing target)" },
};

const SUBSTITUTES = new Set(["substitute", "in-nature-of-substitute"]);
const CLOSED = new Set(["withdrawn", "fell", "rejected", "ruled-out"]);

export function degreeStyle(degree: number | null) {
  if (degree === null) return DEGREE_STYLE.none;
  return degree <= 1 ? DEGREE_STYLE["1"] : degree === 2 ? DEGREE_STYLE["2"] : DEGREE_STYLE.high;
}

/** Badge counts: open findings by severity, and overridden ones. */
export function badgeCounts(findings: FindingView[]) {
  const open = findings.filter((f) => !f.overridden);
  return { error: open.filter((f) => f.severity === "error").length, warning: open.filter((f) => f.severity === "warning").length, info: open.filter((f) => f.severity === "info").length, overridden: findings.length - open.length };
}

export function Badges({ findings }: { findings: FindingView[] }) {
  const c = badgeCounts(findings);
  return (
    <span className="flex gap-1">
      <span className="sr-only">{`${c.error} ${c.error === 1 ? "error" : "errors"}, ${c.warning} ${c.warning === 1 ? "warning" : "warnings"}, ${c.info} ${c.info === 1 ? "note" : "notes"}, ${c.overridden} overridden`}</span>
      {c.error > 0 && <span aria-hidden="true" className="rounded-full bg-verdict-bar px-1.5 text-xs font-bold text-white">✕ {c.error}</span>}
      {c.warning > 0 && <span aria-hidden="true" className="rounded-full bg-verdict-query px-1.5 text-xs font-bold text-white">? {c.warning}</span>}
      {c.info > 0 && <span aria-hidden="true" className="rounded-full border border-chamber bg-white px-1.5 text-xs font-bold text-chamber">i {c.info}</span>}
      {c.overridden > 0 && <span aria-hidden="true" className="rounded-full bg-verdict-ok px-1.5 text-xs font-bold text-white">⚖ {c.overridden}</span>}
    </span>
  );
}

export default function TreeNodeCard({ data }: NodeProps<TreeFlowNode>) {
  const { node, findings, selected } = data;
  const ring = selected ? "ring-4 ring-brass" : "";
  if (node.kind === "measure") {
    return (
      <div style={NODE_SIZE.measure} className={`flex flex-col justify-center rounded-lg border-2 border-chamber-dark bg-chamber px-3 text-white shadow ${ring}`}>
        <span className="font-serif text-xl font-semibold leading-tight">{node.label}</span>
        <span className="truncate text-sm text-white">{node.title}</span>
        <Handle type="source" position={Position.Right} className="!bg-chamber-dark" />
      </div>
    );
  }
  if (node.kind === "section") {
    return (
      <div style={NODE_SIZE.section} className={`flex flex-col justify-center rounded-sm border border-dashed border-ink-soft bg-vellum px-2 ${ring}`}>
        <Handle type="target" position={Position.Left} className="!bg-ink-soft" />
        <span className="text-base font-semibold text-ink">§ {node.label}{node.status !== "open" ? ` · ${statusLabel("section", node.status)}` : ""}</span>
        <span className="truncate text-sm text-ink-soft">{node.title ?? ""}</span>
        <Handle type="source" position={Position.Right} className="!bg-ink-soft" />
      </div>
    );
  }
  const d = degreeStyle(node.degree);
  const substitute = SUBSTITUTES.has(node.form ?? "");
  const closed = CLOSED.has(node.status ?? "");
  const c = badgeCounts(findings);
  const border = c.error > 0 ? "border-verdict-bar" : c.warning > 0 ? "border-verdict-query" : "border-rule";
  return (
    <div style={NODE_SIZE.amendment} className={`relative flex overflow-hidden rounded-md bg-white shadow-sm ${substitute ? "border-4 border-double" : "border-2"} ${border} ${closed ? "opacity-60" : ""} ${ring}`} data-testid={`node-${node.label}`}>
      <Handle type="target" position={Position.Left} className="!bg-ink-soft" />
      <span className={`w-2 shrink-0 ${d.bar}`} aria-hidden="true" />
      <div className="min-w-0 flex-1 px-2 py-1">
        <div className="flex items-center justify-between gap-1">
          <span className={`text-base font-bold text-ink ${closed ? "line-through" : ""}`}>
            {node.label}
            <span className="ml-1 text-sm font-semibold text-ink-soft">{node.degree !== null ? `${node.degree}°` : "?°"}</span>
          </span>
          <Badges findings={findings} />
        </div>
        <div className="truncate text-sm text-ink">{node.title ?? formLabel(node.form)}</div>
        <div className="truncate text-xs text-ink-soft">
          {node.role === "substitute-for-amendment" ? `substitute for ${node.parent} · ` : node.role === "perfecting-under-substitute" ? `under ${node.underSubstitute} · ` : substitute ? "substitute · " : ""}
          {statusLabel("amendment", node.status)}
        </div>
      </div>
      <Handle type="source" position={Position.Right} className="!bg-ink-soft" />
    </div>
  );
}
