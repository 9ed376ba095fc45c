import { useEffect, useState } from "react";
import { z } from "zod";
import { useLatestAnswer } from "../shared/useLatestAnswer.ts";
import { apiCall, ApiError } from "../shared/api.ts";
import { librarySchema, type Library } from "../rulebooks/schemas.ts";
import LegalMovesList from "./LegalMovesList.tsx";
import { movesAnswerSchema, sittingSchema, sittingsSchema, type Verdict } from "./schemas.ts";
import { Alert } from "../shared/Alert.tsx";

interface Entry {
  motion: string;
  degree?: number;
}
interface Facts {
  speakerHasFloor: boolean;
  debateBegun: boolean;
  chairHasRuled: boolean;
  voteTaken: boolean;
  tabled: number;
  quorumPresent: boolean;
  committeeOfTheWhole: boolean;
}
const NO_FACTS: Facts = { speakerHasFloor: false, debateBegun: false, chairHasRuled: false, voteTaken: false, tabled: 0, quorumPresent: true, committeeOfTheWhole: false };

/** Pose a hypothetical floor (push and pop pending motions, set the floor facts) and see every motion's verdict. Never touches a sitting. */
export default function MovesExplorer() {
  const [pending, setPending] = useState<Entry[]>([]);
  const [facts, setFacts] = useState<Facts>(NO_FACTS);
  const [version, setVersion] = useState("");
  const [library, setLibrary] = useState<Library | null>(null);
  const [answer, setAnswer] = useState<z.output<typeof movesAnswerSchema> | null>(null);
  const [catalogue, setCatalogue] = useState<Verdict[]>([]);
  const [choice, setChoice] = useState("");
  const [degree, setDegree] = useState("");
  const [error, setError] = useState<{ message: string; issues: Array<{ path: string; message: string }> } | null>(null);

  useEffect(() => {
    apiCall(librarySchema, "/api/rulebooks").then(setLibrary, () => setLibrary(null));
  }, []);

  // Only the answer to the question as it now stands counts (an earlier one arriving late is dropped).
  useLatestAnswer(
    movesAnswerSchema,
    { url: "/api/moves", method: "POST", body: { state: { pending, floor: facts }, ...(version ? { version } : {}) } },
    (a) => {
      setAnswer(a);
      setError(null);
      if (catalogue.length === 0 || pending.length === 0) setCatalogue(a.moves);
    },
    (e) => setError({ message: e instanceof Error ? e.message : "Could not ask.", issues: e instanceof ApiError ? e.issues : [] }),
  );

  const nameOf = (id: string) => catalogue.find((m) => m.motion === id)?.name ?? id;
  // The degree an amendment takes follows the stack (it applies to the question directly below it).
  const degrees: Array<number | null> = [];
  pending.forEach((p, i) => degrees.push(p.motion === "amend" ? (i > 0 && pending[i - 1].motion === "amend" ? (degrees[i - 1] ?? 0) + 1 : 1) : null));

  async function copyLive() {
    try {
      const list = await apiCall(sittingsSchema, "/api/floor/sittings");
      const open = list.sittings.find((s) => s.status === "open");
      if (!open) throw new Error("No sitting is open.");
      const s = await apiCall(sittingSchema, `/api/floor/sittings/${open.id}`);
      setPending(s.board.pending.map((p) => ({ motion: p.motion })));
      const top = s.board.pending[s.board.pending.length - 1];
      setFacts({ speakerHasFloor: s.board.speaker !== null, debateBegun: top?.debateBegun ?? false, chairHasRuled: s.board.chairHasRuled, voteTaken: s.board.voteTaken, tabled: s.board.tabled, quorumPresent: facts.quorumPresent, committeeOfTheWhole: s.board.committeeOfTheWhole });
    } catch (e) {
      setError({ message: e instanceof Error ? e.message : "Could not copy the floor.", issues: [] });
    }
  }

  const toggle = (k: keyof Omit<Facts, "tabled" | "quorumPresent">, label: string) => (
    <label className="flex items-center gap-2 text-sm">
      <input type="checkbox" checked={facts[k]} onChange={(e) => setFacts({ ...facts, [k]: e.target.checked })} /> {label}
    </label>
  );

  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_minmax(0,1.2fr)]">
      <div className="space-y-4">
        <section className="gw-card space-y-3" aria-labelledby="hyp-h">
          <h2 id="hyp-h" className="text-step-1">The floor to ask about</h2>
          <label className="text-sm">
            <span className="gw-label">Rulebook</span>
            <select className="gw-input" value={version} onChange={(e) => setVersion(e.target.value)}>
              <option value="">The version in force{library?.inForce ? ` (version ${library.inForce.number})` : ""}</option>
              {library?.versions.map((v) => <option key={v.id} value={v.id}>Version {v.number}: {v.title}</option>)}
            </select>
          </label>
          <div>
            <p className="gw-label">Pending questions (top is immediately pending)</p>
            {pending.length === 0 ? (
              <p className="text-sm text-ink-soft" data-testid="hyp-empty">Nothing pending.</p>
            ) : (
              <ol className="mt-1 space-y-1" data-testid="hyp-stack">
                {[...pending].reverse().map((p, j) => {
                  const i = pending.length - 1 - j;
                  return (
                    <li key={i} className={`rounded-md border px-2 py-1 text-sm ${j === 0 ? "border-chamber bg-chamber-tint" : "border-rule bg-white"}`}>
                      {nameOf(p.motion)}
                      {degrees[i] !== null && <span className="text-ink-soft"> · degree {p.degree ?? degrees[i]}</span>}
                    </li>
                  );
                })}
              </ol>
            )}
          </div>
          <form
            className="flex flex-wrap items-end gap-2"
            onSubmit={(e) => {
              e.preventDefault();
              if (!choice) return;
              setPending([...pending, choice === "amend" && degree ? { motion: choice, degree: Number(degree) } : { motion: choice }]);
              setDegree("");
            }}
          >
            <label className="min-w-48 flex-1 text-sm">
              <span className="gw-label">Motion to push</span>
              <select className="gw-input" value={choice} onChange={(e) => setChoice(e.target.value)} data-testid="hyp-choice">
                <option value="">Choose…</option>
                {catalogue.map((m) => <option key={m.motion} value={m.motion}>{m.name}</option>)}
              </select>
            </label>
            {choice === "amend" && (
              <label className="w-36 text-sm">
                <span className="gw-label">Amendment degree</span>
                <select className="gw-input" value={degree} onChange={(e) => setDegree(e.target.value)}>
                  <option value="">As the stack gives</option>
                  {[1, 2, 3].map((d) => <option key={d} value={d}>{d}</option>)}
                </select>
              </label>
            )}
            <button className="gw-btn" disabled={!choice}>Push</button>
            <button type="button" className="gw-btn-quiet" disabled={pending.length === 0} onClick={() => setPending(pending.slice(0, -1))}>Pop</button>
            <button type="button" className="gw-btn-quiet" disabled={pending.length === 0} onClick={() => setPending([])}>Clear</button>
          </form>
          <fieldset className="space-y-1">
            <legend className="gw-label">Floor facts</legend>
            {toggle("speakerHasFloor", "Another member has the floor")}
            {toggle("debateBegun", "Debate on the pending question has begun")}
            {toggle("chairHasRuled", "The chair has just ruled")}
            {toggle("voteTaken", "A vote has been taken this sitting")}
            {toggle("committeeOfTheWhole", "Sitting as a Committee of the Whole")}
            <label className="flex items-center gap-2 text-sm">
              <input type="checkbox" checked={!facts.quorumPresent} onChange={(e) => setFacts({ ...facts, quorumPresent: !e.target.checked })} /> No quorum is present
            </label>
            <label className="flex items-center gap-2 text-sm">
              Questions on the table
              <input type="number" min={0} max={99} className="gw-input w-20" value={facts.tabled} onChange={(e) => setFacts({ ...facts, tabled: Math.max(0, Math.min(99, Number(e.target.value) || 0)) })} />
            </label>
          </fieldset>
          <button type="button" className="gw-btn-quiet" onClick={() => void copyLive()}>Start from the live floor</button>
          {error && <Alert issues={error.issues} showPaths listFrom={1}>{error.message}</Alert>}
        </section>
      </div>
      {answer && <LegalMovesList moves={answer.moves} caption={`rulebook version ${answer.rulebook.number}`} />}
    </div>
  );
}
