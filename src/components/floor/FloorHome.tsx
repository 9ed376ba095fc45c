import { useEffect, useState } from "react";
import { apiCall } from "../shared/api.ts";
import { when } from "../shared/dates.ts";
import FloorBoard from "./FloorBoard.tsx";
import { sittingsSchema } from "./schemas.ts";
import { z } from "zod";
import { Alert } from "../shared/Alert.tsx";

/** The sittings of the chamber, with the board of the chosen one (the latest open sitting by default). */
export default function FloorHome({ canRecord, initial }: { canRecord: boolean; initial: string | null }) {
  const [list, setList] = useState<z.output<typeof sittingsSchema>["sittings"] | null>(null);
  const [chosen, setChosen] = useState<string | null>(initial);
  const [title, setTitle] = useState("");
  const [error, setError] = useState<string | null>(null);

  async function load() {
    try {
      const r = await apiCall(sittingsSchema, "/api/floor/sittings");
      setList(r.sittings);
      setChosen((c) => c ?? r.sittings.find((s) => s.status === "open")?.id ?? r.sittings[0]?.id ?? null);
    } catch (e) {
      setError(e instanceof Error ? e.message : "Could not load the sittings.");
    }
  }
  useEffect(() => void load(), []);

  return (
    <div className="space-y-5">
      <div className="flex flex-wrap items-end gap-4">
        {list && list.length > 0 && (
          <label className="text-sm">
            <span className="gw-label">Sitting</span>
            <select className="gw-input" value={chosen ?? ""} onChange={(e) => setChosen(e.target.value)} data-testid="sitting-select">
              {list.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.title} — {s.status === "open" ? "open" : `closed ${s.closedAt ? when(s.closedAt) : ""}`}
                </option>
              ))}
            </select>
          </label>
        )}
        {canRecord && (
          <form
            className="flex items-end gap-2"
            onSubmit={async (e) => {
              e.preventDefault();
              setError(null);
              try {
                const s = await apiCall(z.object({ id: z.string() }), "/api/floor/sittings", { method: "POST", body: { title } });
                setTitle("");
                setChosen(s.id);
                await load();
              } catch (err) {
                setError(err instanceof Error ? err.message : "Could not open the sitting.");
              }
            }}
          >
            <label className="text-sm">
              <span className="gw-label">Open a new sitting</span>
              <input className="gw-input" placeholder="Sitting of …" value={title} maxLength={200} onChange={(e) => setTitle(e.target.value)} required />
            </label>
            <button className="gw-btn">Open sitting</button>
          </form>
        )}
        <a href="/floor/moves" className="text-sm">Ask about a hypothetical floor →</a>
      </div>
      <Alert>{error}</Alert>
      {list && list.length === 0 && <p className="text-ink-soft">No sittings yet.{canRecord ? " Open one above." : ""}</p>}
      {chosen && <FloorBoard key={chosen} sittingId={chosen} canRecord={canRecord} />}
    </div>
  );
}
