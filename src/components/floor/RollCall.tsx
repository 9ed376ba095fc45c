import { useRef, type KeyboardEvent } from "react";
import { ROLL_POSITIONS, type RollPosition } from "../../lib/procedure/voting-methods.ts";
import type { RosterMember } from "./schemas.ts";
import { POSITION_WORDS, rollCounts } from "./vote-entry.ts";

/** Keys for a quick roll call: the letter sets the member's answer and moves to the next member. */
const KEYS: Record<string, RollPosition> = { y: "yea", n: "nay", p: "present", a: "present", v: "not-voting", r: "recused" };
const KEY_OF: Record<RollPosition, string> = { yea: "Y", nay: "N", present: "P", "not-voting": "V", recused: "R" };

interface Props {
  id: string;
  roster: RosterMember[];
  roll: Record<string, RollPosition>;
  onChange: (roll: Record<string, RollPosition>) => void;
  /** Members whose presence makes a quorum, if the rulebook sets one. */
  quorum: number | null;
  disabled?: boolean;
  error?: string;
}

/**
 * The roll call, member by member from the roster: each answer by click or by key (Y yea, N nay,
 * P or A present, V not voting, R recused), focus moving on to the next member; totals and the
 * quorum as the roll fills.
 */
export default function RollCall({ id, roster, roll, onChange, quorum, disabled, error }: Props) {
  const list = useRef<HTMLOListElement>(null);
  // The roll as last given, so answers typed faster than the page redraws are all kept.
  const latest = useRef(roll);
  latest.current = roll;
  const answer = (member: string, p: RollPosition) => {
    latest.current = { ...latest.current, [member]: p };
    onChange(latest.current);
  };
  const c = rollCounts(roll);
  const answered = Object.keys(roll).length;
  const present = c.yea + c.nay + c.present + c.recused;

  function focusRow(i: number) {
    const row = list.current?.querySelectorAll<HTMLElement>("[data-roll-row]")[i];
    (row?.querySelector<HTMLInputElement>("input:checked") ?? row?.querySelector<HTMLInputElement>("input"))?.focus();
  }
  function onKey(e: KeyboardEvent, i: number, member: string) {
    const p = KEYS[e.key.toLowerCase()];
    if (p && !e.ctrlKey && !e.metaKey && !e.altKey) {
      e.preventDefault();
      answer(member, p);
      // Focus moves at once, so a clerk typing quickly never answers twice for the same member.
      focusRow(Math.min(i + 1, roster.length - 1));
    }
  }
  function markRest(p: RollPosition) {
    const next = { ...roll };
    for (const m of roster) if (!next[m.id]) next[m.id] = p;
    onChange(next);
  }

  return (
    <div className="space-y-2" data-testid="roll-call">
      <p className="gw-hint" id={`${id}-keys`}>
        Keys: Y yea · N nay · P present · V not voting · R recused — the next member follows.
      </p>
      <p className="text-sm font-semibold" role="status" data-testid="roll-totals">
        Yea {c.yea} · Nay {c.nay} · Present {c.present} · Not voting {c["not-voting"]} · Recused {c.recused} · No answer yet {roster.length - answered}
      </p>
      {quorum !== null && (
        <p className={`text-sm ${present >= quorum ? "text-verdict-ok" : "text-verdict-bar"}`} data-testid="roll-quorum">
          {present} present of {roster.length}; the quorum is {quorum}: {present >= quorum ? "a quorum is present" : "no quorum yet"}.
        </p>
      )}
      {error && (
        <p id={`${id}-roll-err`} className="gw-error">
          {error}
        </p>
      )}
      <ol ref={list} className="max-h-96 divide-y divide-rule overflow-y-auto rounded-md border border-rule bg-white" aria-describedby={`${id}-keys`}>
        {roster.map((m, i) => (
          <li key={m.id} data-roll-row data-member={m.name} className="flex flex-wrap items-center gap-x-3 gap-y-1 px-2 py-1" onKeyDown={(e) => onKey(e, i, m.id)}>
            <fieldset className="contents">
              <legend className="min-w-44 flex-1 text-sm">
                <span className="font-semibold">{m.name}</span> <span className="text-ink-soft">{m.bloc}</span>
              </legend>
              <span className="flex flex-wrap gap-1">
                {ROLL_POSITIONS.map((p) => (
                  <label key={p} className={`cursor-pointer rounded border px-1.5 py-0.5 text-xs focus-within:ring-2 focus-within:ring-brass ${roll[m.id] === p ? "border-chamber bg-chamber-tint font-semibold" : "border-rule"}`}>
                    <input type="radio" className="sr-only" name={`${id}-roll-${m.id}`} value={p} checked={roll[m.id] === p} disabled={disabled} aria-label={`${m.name}: ${POSITION_WORDS[p]}`} onChange={() => answer(m.id, p)} />
                    <span aria-hidden="true">{KEY_OF[p]}</span> {POSITION_WORDS[p]}
                  </label>
                ))}
              </span>
            </fieldset>
          </li>
        ))}
      </ol>
      <div className="flex flex-wrap gap-2">
        <button type="button" className="gw-btn-quiet" disabled={disabled || answered === roster.length} onClick={() => markRest("not-voting")}>
          Mark everyone not yet answered as not voting
        </button>
      </div>
    </div>
  );
}
