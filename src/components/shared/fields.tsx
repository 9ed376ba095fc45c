/**
 * The islands' one set of form widgets and their one field-issue lookup. Each widget is a label,
 * a control and the messages the server (or a local zod parse) gave for its exact path; an
 * invalid control carries aria-invalid and aria-describedby pointing at the shown message, so a
 * screen reader reads the error with the field.
 *
 * Ids: `f-<path>` (anything but letters, digits, _ and - becomes _) unless `id` is given; the
 * message is `<id>-err`, the hint `<id>-hint`. Browser tests select on these ids and on
 * `data-issue-path`, so keep them.
 */
import type { ReactNode } from "react";
import { ApiError, type Issue } from "./api.ts";

/** The messages for one path ("rules.0.motion"); [] when it has none. */
export type IssueLookup = (path: string) => string[];

/** No issues: for forms that have not been sent yet. */
export const noIssues: IssueLookup = () => [];

/**
 * The one field-issue lookup: issues (or an ApiError's, or none for any other error) by path.
 * `strip` removes a prefix the route adds ("content." for a ruling's content). A path also
 * answers for its first segment when `byField` is set (`sponsors.2` shows at `sponsors`).
 */
export function issueLookup(source: Issue[] | unknown, options: { strip?: string; byField?: boolean } = {}): IssueLookup {
  const issues: Issue[] = Array.isArray(source) ? (source as Issue[]) : source instanceof ApiError ? source.issues : [];
  const map = new Map<string, string[]>();
  const add = (path: string, message: string) => map.set(path, [...(map.get(path) ?? []), message]);
  for (const i of issues) {
    const path = options.strip && i.path.startsWith(options.strip) ? i.path.slice(options.strip.length) : i.path;
    add(path, i.message);
    if (options.byField && path.includes(".")) add(path.split(".")[0], i.message);
  }
  return (path) => map.get(path) ?? [];
}

/** The id of the control for `path`. */
export const fieldId = (path: string) => `f-${path.replace(/[^A-Za-z0-9_-]/g, "_")}`;

/** The ARIA attributes of a control whose messages are at `path` (and whose hint, if any, is shown). */
export function describedBy(id: string, path: string | undefined, at: IssueLookup, hint?: boolean) {
  const invalid = path !== undefined && at(path).length > 0;
  const ids = [invalid ? `${id}-err` : null, hint ? `${id}-hint` : null].filter(Boolean);
  return { "aria-invalid": invalid || undefined, "aria-describedby": ids.length ? ids.join(" ") : undefined };
}

/** The messages for `path`, shown under its control (nothing when there are none). */
export function FieldMessages({ id, path, at }: { id?: string; path: string; at: IssueLookup }) {
  const msgs = at(path);
  if (!msgs.length) return null;
  return (
    <p id={`${id ?? fieldId(path)}-err`} className="gw-error" data-issue-path={path}>
      {msgs.join("; ")}
    </p>
  );
}

interface Base {
  /** Where the server reports issues for this field; also gives the id unless `id` is set. */
  path?: string;
  id?: string;
  label: ReactNode;
  at?: IssueLookup;
  disabled?: boolean;
  hideLabel?: boolean;
  hint?: ReactNode;
  className?: string;
  /** Shown after the control, before the messages. */
  children?: ReactNode;
}

function idOf(b: Base): string {
  if (b.id) return b.id;
  if (b.path) return fieldId(b.path);
  throw new Error("a field needs a path or an id");
}

function control(b: Base) {
  const id = idOf(b);
  return { id, disabled: b.disabled, ...describedBy(id, b.path, b.at ?? noIssues, !!b.hint) };
}

function Wrap({ b, children }: { b: Base; children: ReactNode }) {
  const id = idOf(b);
  return (
    <div className={b.className}>
      <label htmlFor={id} className={b.hideLabel ? "sr-only" : "gw-label"}>
        {b.label}
      </label>
      {children}
      {b.children}
      {b.hint && (
        <p id={`${id}-hint`} className="gw-hint">
          {b.hint}
        </p>
      )}
      {b.path !== undefined && <FieldMessages id={id} path={b.path} at={b.at ?? noIssues} />}
    </div>
  );
}

/** ARIA and id attributes for a control of one's own (a select with groups, a multiple choice, a file). */
export type ControlAttributes = ReturnType<typeof control>;

/** A labelled control of one's own, with the same id, hint and messages as the widgets below. */
export function Field(p: Base & { control: (attrs: ControlAttributes) => ReactNode }) {
  return <Wrap b={p}>{p.control(control(p))}</Wrap>;
}

type TextProps = Base & {
  maxLength?: number;
  list?: string;
  multiline?: boolean;
  rows?: number;
  type?: string;
  inputMode?: "numeric" | "decimal" | "text" | "email";
  placeholder?: string;
  name?: string;
  autoComplete?: string;
} & ({ value: string | undefined; onChange: (v: string) => void } | { value?: undefined; onChange?: undefined; defaultValue?: string });

/** A labelled text input or textarea: controlled (`value` + `onChange`) or, in a plain form, uncontrolled (`name`, `defaultValue`). */
export function TextField(p: TextProps) {
  const common = { ...control(p), className: "gw-input", maxLength: p.maxLength, placeholder: p.placeholder, name: p.name };
  const value = p.onChange ? { value: p.value ?? "", onChange: (e: { target: { value: string } }) => p.onChange!(e.target.value) } : { defaultValue: "defaultValue" in p ? p.defaultValue : undefined };
  return (
    <Wrap b={p}>
      {p.multiline ? <textarea {...common} {...value} rows={p.rows ?? 2} /> : <input {...common} {...value} type={p.type} inputMode={p.inputMode} list={p.list} autoComplete={p.autoComplete} />}
    </Wrap>
  );
}

/** A number, or blank for null when `nullable`. */
export function NumberField(p: Base & { value: number | null | undefined; onChange: (v: number | null) => void; nullable?: boolean; min?: number; max?: number }) {
  return (
    <Wrap b={p}>
      <input
        {...control(p)}
        type="number"
        className="gw-input"
        min={p.min}
        max={p.max}
        value={p.value ?? ""}
        placeholder={p.nullable ? "none" : undefined}
        onChange={(e) => p.onChange(e.target.value === "" ? (p.nullable ? null : 0) : Number(e.target.value))}
      />
    </Wrap>
  );
}

/** A choice among fixed values (shown by `labels` or as they are); "—" while none is chosen. */
export function SelectField<T extends string>(p: Base & { value: T | undefined; options: readonly T[]; labels?: Partial<Record<T, string>>; onChange: (v: T) => void }) {
  return (
    <Wrap b={p}>
      <select {...control(p)} className="gw-input" value={p.value ?? ""} onChange={(e) => p.onChange(e.target.value as T)}>
        {p.value === undefined && <option value="">—</option>}
        {p.options.map((o) => (
          <option key={o} value={o}>
            {p.labels?.[o] ?? o}
          </option>
        ))}
      </select>
    </Wrap>
  );
}

/** A choice among records ({id, label}) after one empty choice (`empty`, value ""). */
export function ChoiceField(p: Base & { value: string; empty: string; choices: ReadonlyArray<{ id: string; label: string }>; onChange: (v: string) => void }) {
  return (
    <Wrap b={p}>
      <select {...control(p)} className="gw-input" value={p.value} onChange={(e) => p.onChange(e.target.value)}>
        <option value="">{p.empty}</option>
        {p.choices.map((c) => (
          <option key={c.id} value={c.id}>
            {c.label}
          </option>
        ))}
      </select>
    </Wrap>
  );
}

export function CheckField(p: Omit<Base, "hideLabel" | "hint"> & { checked: boolean; onChange: (v: boolean) => void }) {
  const id = idOf(p);
  return (
    <div className={p.className}>
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" {...control(p)} checked={p.checked} onChange={(e) => p.onChange(e.target.checked)} /> {p.label}
      </label>
      {p.path !== undefined && <FieldMessages id={id} path={p.path} at={p.at ?? noIssues} />}
    </div>
  );
}
