import type { ReactNode } from "react";
import { VOTE_FIELD_LABELS, type VoteDraft, type VoteField } from "./vote-entry.ts";

interface Props {
  /** Unique per form on the page (ids of inputs and messages). */
  id: string;
  value: VoteDraft;
  onChange: (v: VoteDraft) => void;
  errors: Partial<Record<VoteField, string>>;
  /** The threshold cannot be judged without a count: voice is not offered. */
  needsCount: boolean;
  disabled?: boolean;
}

function FieldError({ id, children }: { id: string; children?: ReactNode }) {
  if (!children) return null;
  return (
    <p id={id} className="gw-error">
      {children}
    </p>
  );
}

/** Result, how the vote was decided and the count: no default, every field named in its error. */
export default function VoteFields({ id, value, onChange, errors, needsCount, disabled }: Props) {
  const set = (patch: Partial<VoteDraft>) => onChange({ ...value, ...patch });
  const err = (f: VoteField) => (errors[f] ? { "aria-invalid": true as const, "aria-describedby": `${id}-${f}-err` } : {});
  return (
    <div className="space-y-3">
      <fieldset {...(errors.result ? { "aria-describedby": `${id}-result-err` } : {})}>
        <legend className="gw-label">Result</legend>
        <div className="flex flex-wrap gap-4">
          {(["adopted", "rejected"] as const).map((r) => (
            <label key={r} className="flex items-center gap-2 text-sm">
              <input type="radio" name={`${id}-result`} value={r} checked={value.result === r} disabled={disabled} onChange={() => set({ result: r })} {...err("result")} />
              {r === "adopted" ? "Adopted" : "Rejected"}
            </label>
          ))}
        </div>
        <FieldError id={`${id}-result-err`}>{errors.result}</FieldError>
      </fieldset>
      <fieldset {...(errors.method ? { "aria-describedby": `${id}-method-err` } : {})}>
        <legend className="gw-label">How it was decided</legend>
        <div className="flex flex-wrap gap-4">
          <label className="flex items-center gap-2 text-sm">
            <input type="radio" name={`${id}-method`} value="voice" checked={value.method === "voice"} disabled={disabled || needsCount} onChange={() => set({ method: "voice", yes: "", no: "", abstain: "" })} {...err("method")} />
            By voice (the chair declared it, no count)
          </label>
          <label className="flex items-center gap-2 text-sm">
            <input type="radio" name={`${id}-method`} value="division" checked={value.method === "division"} disabled={disabled} onChange={() => set({ method: "division" })} {...err("method")} />
            Counted
          </label>
        </div>
        {needsCount && <p className="gw-hint">This question needs a count: its threshold cannot be judged by voice.</p>}
        {value.method === "division" && <p className="gw-hint">Leave Abstaining empty if no one abstained.</p>}
        <FieldError id={`${id}-method-err`}>{errors.method}</FieldError>
      </fieldset>
      {value.method === "division" && (
        <div className="flex flex-wrap items-start gap-3">
          {(["yes", "no", "abstain"] as const).map((k) => (
            <div key={k} className="w-32 text-sm">
              <label className="gw-label" htmlFor={`${id}-${k}`}>
                {VOTE_FIELD_LABELS[k]}
              </label>
              <input id={`${id}-${k}`} className="gw-input" inputMode="numeric" autoComplete="off" value={value[k]} disabled={disabled} maxLength={7} onChange={(e) => set({ [k]: e.target.value })} {...err(k)} />
            </div>
          ))}
          <div className="basis-full space-y-0">
            {(["yes", "no", "abstain"] as const).map((k) => (
              <FieldError key={k} id={`${id}-${k}-err`}>
                {errors[k]}
              </FieldError>
            ))}
          </div>
        </div>
      )}
    </div>
  );
}
