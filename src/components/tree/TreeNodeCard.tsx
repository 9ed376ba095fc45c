import { Handle, Position, type NodeProps, type Node } from "@xyflow/react";
import type { FindingView, TreeNodeView } from "../../lib/measures/measure-schemas.ts";

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
    <span className="flex gap-1" aria-label={`${c.error} errors, ${c.warning} warnings, ${c.info} notes, ${c.overridden} overridden`}>
      {c.error > 0 && <span className="rounded-full bg-verdict-bar px-1.5 text-[11px] font-bold text-white">✕ {c.error}</span>}
      {c.warning > 0 && <span className="rounded-full bg-verdict-query px-1.5 text-[11px] font-bold text-white">? {c.warning}</span>}
      {c.info > 0 && <span className="rounded-full border border-chamber bg-white px-1.5 text-[11px] font-bold text-chamber">i {c.info}</span>}
      {c.overridden > 0 && <span className="rounded-full bg-verdict-ok px-1.5 text-[11px] font-bold text-white">⚖ {c.overridden}</span>}
    </span>
  );
}

export default function TreeNodeCard({ data }: NodeProps<TreeFlowNode>) {
  const { node, findings, selected } = data;
  const ring = selected ? "ring-4 ring-brass" : "";
  if (node.kind === "measure") {
    return (
      <div className={`flex h-[76px] w-[230px] flex-col justify-center rounded-lg border-2 border-chamber-dark bg-chamber px-3 text-white shadow ${ring}`}>
        <span className="font-serif text-lg font-semibold leading-tight">{node.label}</span>
        <span className="truncate text-xs text-chamber-tint">{node.title}</span>
        <Handle type="source" position={Position.Right} className="!bg-chamber-dark" />
      </div>
    );
  }
  if (node.kind === "section") {
    return (
      <div className={`flex h-[52px] w-[190px] flex-col justify-center rounded-sm border border-dashed border-ink-soft bg-vellum px-2 ${ring}`}>
        <Handle type="target" position={Position.Left} className="!bg-ink-soft" />
        <span className="text-xs font-semibold text-ink">§ {node.label}{node.status !== "open" ? ` · ${node.status}` : ""}</span>
        <span className="truncate text-[11px] text-ink-soft">{node.title ?? ""}</span>
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
    <div className={`relative flex h-[72px] w-[200px] overflow-hidden rounded-md bg-white shadow-sm ${substitute ? "border-4 border-double" : "border-2"} ${border} ${closed ? "opacity-60" : ""} ${ring}`} data-testid={`node-${node.label}`}>
      <Handle type="target" position={Position.Left} className="!bg-ink-soft" />
      <span className={`w-2 shrink-0 ${d.bar}`} aria-hidden="true" />
      <div className="min-w-0 flex-1 px-2 py-1">
        <div className="flex items-center justify-between gap-1">
          <span className={`text-sm font-bold text-ink ${closed ? "line-through" : ""}`}>
            {node.label}
            <span className="ml-1 text-[11px] font-semibold text-ink-soft">{node.degree !== null ? `${node.degree}°` : "?°"}</span>
          </span>
          <Badges findings={findings} />
        </div>
        <div className="truncate text-[11px] text-ink">{node.title ?? node.form}</div>
        <div className="truncate text-[10px] uppercase tracking-wide text-ink-soft">
          {node.role === "substitute-for-amendment" ? `substitute for ${node.parent} · ` : node.role === "perfecting-under-substitute" ? `under ${node.underSubstitute} · ` : substitute ? "substitute · " : ""}
          {node.status}
        </div>
      </div>
      <Handle type="source" position={Position.Right} className="!bg-ink-soft" />
    </div>
  );
}
