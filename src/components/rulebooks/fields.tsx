/** Small labelled form controls for the rulebook editor; each shows the validation messages for its exact path. */
import type { ReactNode } from "react";
import type { Issue } from "./api.ts";

export type IssueLookup = (path: string) => string[];

export function issueLookup(issues: Issue[]): IssueLookup {
  const map = new Map<string, string[]>();
  for (const i of issues) map.set(i.path, [...(map.get(i.path) ?? []), i.message]);
  return (path) => map.get(path) ?? [];
}

const fid = (path: string) => `f-${path.replace(/[^A-Za-z0-9_-]/g, "_")}`;

export function Messages({ path, at }: { path: string; at: IssueLookup }) {
  const msgs = at(path);
  if (!msgs.length) return null;
  return (
    <p id={`${fid(path)}-err`} className="gw-error" data-issue-path={path}>
      {msgs.join("; ")}
    </p>
  );
}

interface Base {
  path: string;
  label: string;
  at: IssueLookup;
  disabled?: boolean;
  hideLabel?: boolean;
  hint?: ReactNode;
  className?: string;
}

function wrap(b: Base, control: ReactNode) {
  return (
    <div className={b.className}>
      <label htmlFor={fid(b.path)} className={b.hideLabel ? "sr-only" : "gw-label"}>
        {b.label}
      </label>
      {control}
      {b.hint && <p className="gw-hint">{b.hint}</p>}
      <Messages path={b.path} at={b.at} />
    </div>
  );
}

const a11y = (b: Base) => ({ id: fid(b.path), "aria-invalid": b.at(b.path).length > 0 || undefined, "aria-describedby": b.at(b.path).length ? `${fid(b.path)}-err` : undefined, disabled: b.disabled });

export function TextField(p: Base & { value: string | undefined; onChange: (v: string) => void; maxLength?: number; list?: string; multiline?: boolean }) {
  return wrap(
    p,
    p.multiline ? (
      <textarea {...a11y(p)} className="gw-input" rows={2} value={p.value ?? ""} maxLength={p.maxLength} onChange={(e) => p.onChange(e.target.value)} />
    ) : (
      <input {...a11y(p)} className="gw-input" value={p.value ?? ""} maxLength={p.maxLength} list={p.list} onChange={(e) => p.onChange(e.target.value)} />
    ),
  );
}

/** A number, or blank for null when `nullable`. */
export function NumberField(p: Base & { value: number | null | undefined; onChange: (v: number | null) => void; nullable?: boolean; min?: number; max?: number }) {
  return wrap(
    p,
    <input
      {...a11y(p)}
      type="number"
      className="gw-input"
      min={p.min}
      max={p.max}
      value={p.value ?? ""}
      placeholder={p.nullable ? "none" : undefined}
      onChange={(e) => p.onChange(e.target.value === "" ? (p.nullable ? null : 0) : Number(e.target.value))}
    />,
  );
}

export function SelectField<T extends string>(p: Base & { value: T | undefined; options: readonly T[]; labels?: Partial<Record<T, string>>; onChange: (v: T) => void }) {
  return wrap(
    p,
    <select {...a11y(p)} className="gw-input" value={p.value ?? ""} onChange={(e) => p.onChange(e.target.value as T)}>
      {p.value === undefined && <option value="">—</option>}
      {p.options.map((o) => (
        <option key={o} value={o}>
          {p.labels?.[o] ?? o}
        </option>
      ))}
    </select>,
  );
}

export function CheckField(p: Omit<Base, "hideLabel"> & { checked: boolean; onChange: (v: boolean) => void }) {
  return (
    <div className={p.className}>
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" {...a11y(p)} checked={p.checked} onChange={(e) => p.onChange(e.target.checked)} /> {p.label}
      </label>
      <Messages path={p.path} at={p.at} />
    </div>
  );
}
