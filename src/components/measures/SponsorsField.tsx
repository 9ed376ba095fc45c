import { useId, useState, type KeyboardEvent } from "react";
import { Field, noIssues, type IssueLookup } from "../shared/fields.tsx";

interface Legislator {
  id: string;
  name: string;
  bloc: string;
}

/** Roster entries whose name or bloc contains every typed word (case and accents ignored), chosen ones left out. */
export function matchLegislators(legislators: Legislator[], query: string, chosen: string[]): Legislator[] {
  const fold = (s: string) => s.normalize("NFD").replace(/\p{M}/gu, "").toLowerCase();
  const words = fold(query).split(/\s+/).filter(Boolean);
  return legislators.filter((l) => !chosen.includes(l.id) && words.every((w) => fold(`${l.name} ${l.bloc}`).includes(w)));
}

/**
 * The sponsors of a measure or an amendment: type to filter the roster, tap (or Enter) to add,
 * each sponsor a chip with a remove button. Works by touch and by keyboard (a combobox with a
 * listbox: arrows move, Enter adds, Escape closes). The form receives one hidden `sponsors`
 * value per sponsor, as the multiple select did, so the API is unchanged.
 */
export default function SponsorsField({ id, legislators, defaultValue, at = noIssues, className }: { id: string; legislators: Legislator[]; defaultValue?: string[]; at?: IssueLookup; className?: string }) {
  const [chosen, setChosen] = useState<string[]>(() => (defaultValue ?? []).filter((v) => legislators.some((l) => l.id === v)));
  const [query, setQuery] = useState("");
  const [open, setOpen] = useState(false);
  const [active, setActive] = useState(0);
  const listId = `${id}-list`;
  const optionId = useId();
  const matches = matchLegislators(legislators, query, chosen);
  const shown = open ? matches : [];
  const byId = new Map(legislators.map((l) => [l.id, l]));

  function add(l: Legislator) {
    setChosen((c) => (c.includes(l.id) ? c : [...c, l.id]));
    setQuery("");
    setActive(0);
  }
  function remove(lid: string) {
    setChosen((c) => c.filter((x) => x !== lid));
    document.getElementById(id)?.focus();
  }
  function onKeyDown(e: KeyboardEvent<HTMLInputElement>) {
    if (e.key === "ArrowDown") {
      e.preventDefault();
      setOpen(true);
      setActive((a) => Math.min(a + 1, Math.max(matches.length - 1, 0)));
    } else if (e.key === "ArrowUp") {
      e.preventDefault();
      setActive((a) => Math.max(a - 1, 0));
    } else if (e.key === "Enter") {
      // Enter adds the highlighted name; it never submits the form from this field.
      e.preventDefault();
      if (open && matches[active]) add(matches[active]);
    } else if (e.key === "Escape") {
      if (open) {
        e.preventDefault();
        setOpen(false);
      }
    } else if (e.key === "Backspace" && query === "" && chosen.length > 0) {
      setChosen((c) => c.slice(0, -1));
    }
  }

  return (
    <Field
      id={id}
      path="sponsors"
      label="Sponsors"
      at={at}
      className={className}
      hint="Type part of a name or bloc, then tap a name (or press Enter) to add it."
      control={(attrs) => (
        <div
          className="relative"
          onBlur={(e) => {
            if (!e.currentTarget.contains(e.relatedTarget as Node | null)) setOpen(false);
          }}
        >
          <ul className="flex flex-wrap gap-1.5" aria-label="Chosen sponsors" data-testid="sponsor-chips">
            {chosen.map((lid) => {
              const l = byId.get(lid);
              if (!l) return null;
              return (
                <li key={lid} className="flex items-center gap-1 rounded-full border border-rule bg-chamber-tint py-0.5 pl-3 pr-1 text-sm text-chamber-dark">
                  <input type="hidden" name="sponsors" value={lid} />
                  <span>{l.name} ({l.bloc})</span>
                  <button type="button" className="min-h-8 min-w-8 rounded-full font-bold hover:bg-white" aria-label={`Remove ${l.name}`} onClick={() => remove(lid)}>
                    ×
                  </button>
                </li>
              );
            })}
          </ul>
          {chosen.length === 0 && <p className="text-sm text-ink-soft">No sponsor chosen yet.</p>}
          <input
            {...attrs}
            type="text"
            role="combobox"
            autoComplete="off"
            className="gw-input"
            aria-expanded={shown.length > 0}
            aria-controls={listId}
            aria-autocomplete="list"
            aria-activedescendant={shown.length > 0 && shown[active] ? `${optionId}-${active}` : undefined}
            value={query}
            placeholder="Search the roster"
            onChange={(e) => {
              setQuery(e.target.value);
              setOpen(true);
              setActive(0);
            }}
            onFocus={() => setOpen(true)}
            onClick={() => setOpen(true)}
            onKeyDown={onKeyDown}
          />
          <ul id={listId} role="listbox" aria-label="Legislators" className={shown.length ? "absolute z-20 mt-1 max-h-64 w-full overflow-y-auto rounded-md border border-rule bg-white shadow-lg" : "hidden"}>
            {shown.map((l, i) => (
              <li
                key={l.id}
                id={`${optionId}-${i}`}
                role="option"
                aria-selected={i === active}
                className={`cursor-pointer px-3 py-2 ${i === active ? "bg-chamber-tint text-chamber-dark" : ""}`}
                onMouseDown={(e) => e.preventDefault()}
                onClick={() => add(l)}
              >
                {l.name} ({l.bloc})
              </li>
            ))}
          </ul>
          {open && query.trim() !== "" && matches.length === 0 && <p className="gw-hint" aria-live="polite">No legislator on the roster matches “{query.trim()}”.</p>}
        </div>
      )}
    />
  );
}
