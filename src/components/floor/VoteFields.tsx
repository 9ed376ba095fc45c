import { useEffect, useState, type ReactNode } from "react";
import { apiCall } from "../shared/api.ts";
import RollCall from "./RollCall.tsx";
import { rosterSchema, type RosterMember } from "./schemas.ts";
import { rollCounts, VOTE_FIELD_LABELS, type VoteDraft, type VoteField } from "./vote-entry.ts";

export interface VoteRules {
  /** The ways of voting the rulebook provides for. */
  methods: ReadonlyArray<"voice" | "division" | "recorded">;
  quorum: number | null;
  /** What orders a recorded vote, in words, if the rulebook says. */
  demand: string | null;
  /** The chair has a casting vote on an equal division. */
  casting: boolean;
}
export const ANY_VOTE: VoteRules = { methods: ["voice", "division", "recorded"], quorum: null, demand: null, casting: false };

// The roster is read once per page.
let rosterOnce: Promise<RosterMember[]> | null = null;
function loadRoster(): Promise<RosterMember[]> {
  rosterOnce ??= apiCall(rosterSchema, "/api/measures/sponsors").then(
    (r) => r.legislators,
    (e) => {
      rosterOnce = null;
      throw e;
    },
  );
  return rosterOnce;
}

interface Props {
  /** Unique per form on the page (ids of inputs and messages). */
  id: string;
  value: VoteDraft;
  onChange: (v: VoteDraft) => void;
  errors: Partial<Record<VoteField, string>>;
  /** The threshold cannot be judged without a count: voice is not offered. */
  needsCount: boolean;
  disabled?: boolean;
  rules?: VoteRules;
  /** Told the roster's size once it is loaded (a recorded vote must answer for every member). */
  onRoster?: (size: number) => void;
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
export default function VoteFields({ id, value, onChange, errors, needsCount, disabled, rules = ANY_VOTE, onRoster }: Props) {
  const set = (patch: Partial<VoteDraft>) => onChange({ ...value, ...patch });
  const [roster, setRoster] = useState<RosterMember[] | null>(null);
  const [rosterError, setRosterError] = useState<string | null>(null);
  useEffect(() => {
    if (value.method !== "recorded" || roster) return;
    loadRoster().then(
      (r) => {
        setRoster(r);
        onRoster?.(r.length);
      },
      (e) => setRosterError(e instanceof Error ? e.message : "Could not read the roster."),
    );
  }, [value.method, roster, onRoster]);
  const counts = rollCounts(value.roll);
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
          {rules.methods.includes("voice") && (
            <label className="flex items-center gap-2 text-sm">
              <input type="radio" name={`${id}-method`} value="voice" checked={value.method === "voice"} disabled={disabled || needsCount} onChange={() => set({ method: "voice", yes: "", no: "", abstain: "" })} {...err("method")} />
              By voice (the chair declared it, no count)
            </label>
          )}
          {rules.methods.includes("division") && (
            <label className="flex items-center gap-2 text-sm">
              <input type="radio" name={`${id}-method`} value="division" checked={value.method === "division"} disabled={disabled} onChange={() => set({ method: "division" })} {...err("method")} />
              Division (counted)
            </label>
          )}
          {rules.methods.includes("recorded") && (
            <label className="flex items-center gap-2 text-sm">
              <input type="radio" name={`${id}-method`} value="recorded" checked={value.method === "recorded"} disabled={disabled} onChange={() => set({ method: "recorded", yes: "", no: "", abstain: "" })} {...err("method")} />
              Recorded vote (roll call)
            </label>
          )}
        </div>
        {needsCount && <p className="gw-hint">This question needs a count: its threshold cannot be judged by voice.</p>}
        {value.method === "division" && <p className="gw-hint">Leave Abstaining empty if no one abstained.</p>}
        <FieldError id={`${id}-method-err`}>{errors.method}</FieldError>
      </fieldset>
      {value.method === "recorded" && (
        <div className="space-y-2">
          {rules.demand && (
            <div className="flex flex-wrap items-end gap-3 text-sm">
              <p className="gw-hint basis-full">A recorded vote is ordered by {rules.demand}.</p>
              <div className="w-40">
                <label className="gw-label" htmlFor={`${id}-demandedBy`}>Demanded by (members, optional)</label>
                <input id={`${id}-demandedBy`} className="gw-input" inputMode="numeric" autoComplete="off" maxLength={7} value={value.demandedBy} disabled={disabled} onChange={(e) => set({ demandedBy: e.target.value })} {...err("demandedBy")} />
              </div>
              <FieldError id={`${id}-demandedBy-err`}>{errors.demandedBy}</FieldError>
            </div>
          )}
          {rosterError && <p className="gw-error">{rosterError}</p>}
          {!roster && !rosterError && <p className="text-sm text-ink-soft">Reading the roster…</p>}
          {roster && <RollCall id={id} roster={roster} roll={value.roll} onChange={(roll) => set({ roll, ...(rollCounts(roll).yea !== rollCounts(roll).nay ? { casting: "" } : {}) })} quorum={rules.quorum} disabled={disabled} error={errors.roll} />}
          {rules.casting && counts.yea === counts.nay && counts.yea > 0 && (
            <div className="w-64 text-sm">
              <label className="gw-label" htmlFor={`${id}-casting`}>The chair&apos;s casting vote (the votes are equal)</label>
              <select id={`${id}-casting`} className="gw-input" value={value.casting} disabled={disabled} onChange={(e) => set({ casting: e.target.value === "yea" ? "yea" : e.target.value === "nay" ? "nay" : "" })} {...err("casting")}>
                <option value="">Not given</option>
                <option value="yea">Yea</option>
                <option value="nay">Nay</option>
              </select>
              <FieldError id={`${id}-casting-err`}>{errors.casting}</FieldError>
            </div>
          )}
        </div>
      )}
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
