/**
 * A verdict's citation, and — where the rulebook links the rule to a clause of the chamber's own rules —
 * a button that opens the clause's text (from the latest upload of the chamber's text, read once per page).
 */
import { useState } from "react";
import { z } from "zod";
import { apiCall } from "../shared/api.ts";

const textSchema = z.object({ text: z.object({ clauses: z.array(z.object({ key: z.string(), label: z.string(), title: z.string().nullable(), text: z.string() })) }).nullable() });
type Clauses = z.output<typeof textSchema>["text"];

let loaded: Promise<Clauses> | null = null;
const chamberText = () => (loaded ??= apiCall(textSchema, "/api/rulebooks/text").then((r) => r.text).catch((e) => { loaded = null; throw e; }));

export default function ClauseCitation({ citation, clause }: { citation: string; clause?: string | null }) {
  const [open, setOpen] = useState(false);
  const [found, setFound] = useState<{ label: string; title: string | null; text: string } | null | "missing" | "error">(null);
  if (!clause) return <>{citation}</>;
  async function toggle() {
    if (open) return setOpen(false);
    setOpen(true);
    if (found === null || found === "error") {
      try {
        const t = await chamberText();
        setFound(t?.clauses.find((c) => c.key === clause) ?? "missing");
      } catch {
        setFound("error");
      }
    }
  }
  return (
    <>
      {citation}{" "}
      <button type="button" className="underline" aria-expanded={open} onClick={() => void toggle()} data-testid="open-clause">
        {open ? "hide the clause" : "the clause's text"}
      </button>
      {open && (
        <span className="mt-1 block border-l-2 border-rule pl-3 text-ink" data-testid="clause-text">
          {found === null ? "Loading…" : found === "missing" ? "That clause is not in the chamber's latest text." : found === "error" ? "The chamber's text could not be loaded." : (
            <>
              <span className="font-semibold">{found.label}{found.title ? ` — ${found.title}` : ""}</span> {found.text}
            </>
          )}
        </span>
      )}
    </>
  );
}
