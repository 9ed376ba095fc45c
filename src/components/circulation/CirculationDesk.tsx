import { useEffect, useState, type SubmitEvent } from "react";
import { z } from "zod";
import { CHAMBER_ROLES, ROLE_LABELS, isChamberRole } from "../../lib/permissions.ts";
import FloorDigestForm from "./FloorDigestForm.tsx";
import { useLatestAnswer } from "../shared/useLatestAnswer.ts";
import { apiCall, ApiError } from "../shared/api.ts";
import { listsView, messageView, STATUS_CHIP, STATUS_LABEL, type ListView } from "../rulings/api.ts";
import { Alert } from "../shared/Alert.tsx";
import { when } from "../shared/dates.ts";
import { issueLookup, noIssues, TextField, type IssueLookup } from "../shared/fields.tsx";

const peopleView = z.object({ members: z.array(z.object({ userId: z.string(), name: z.string(), email: z.string(), role: z.string() })) });
const STATUSES = ["queued", "sending", "sent", "failed", "uncertain"] as const;
const circulationsView = z.object({
  circulations: z.array(
    z.object({
      id: z.string(),
      kind: z.enum(["ruling", "floor-digest"]),
      rulingId: z.string().nullable(),
      listName: z.string(),
      subject: z.string(),
      sentByName: z.string(),
      createdAt: z.string(),
      skipped: z.number(),
      status: z.object({ queued: z.number(), sending: z.number(), sent: z.number(), failed: z.number(), uncertain: z.number() }),
    }),
  ),
});
const circulationDetail = z.object({ messages: z.array(messageView) });

type Entry = ListView["entries"][number];

function entryLabel(e: Entry): string {
  if (e.kind === "role") return `Every ${isChamberRole(e.role) ? ROLE_LABELS[e.role].toLowerCase() : e.role}`;
  if (e.kind === "user") return e.name || "A member of the chamber";
  return e.name ? `${e.name} <${e.email}>` : e.email;
}

/** "Name <a@b>" or "a@b", one per line. */
function parseAddresses(text: string): Array<{ kind: "address"; email: string; name: string }> {
  return text
    .split("\n")
    .map((l) => l.trim())
    .filter(Boolean)
    .map((l) => {
      const m = /^(.*?)\s*<([^>]+)>$/.exec(l);
      return m ? { kind: "address" as const, name: m[1].replace(/^"|"$/g, "").trim(), email: m[2].trim() } : { kind: "address" as const, name: "", email: l };
    });
}

function ListEditor({ list, people, onSaved, onCancel }: { list: ListView | null; people: z.output<typeof peopleView>["members"]; onSaved: () => void; onCancel: () => void }) {
  const [name, setName] = useState(list?.name ?? "");
  const [description, setDescription] = useState(list?.description ?? "");
  const [clerks, setClerks] = useState(list?.purpose === "clerks");
  const [roles, setRoles] = useState<string[]>(list?.entries.flatMap((e) => (e.kind === "role" ? [e.role] : [])) ?? []);
  const [users, setUsers] = useState<string[]>(list?.entries.flatMap((e) => (e.kind === "user" ? [e.userId] : [])) ?? []);
  const [addresses, setAddresses] = useState(list?.entries.flatMap((e) => (e.kind === "address" ? [e.name ? `${e.name} <${e.email}>` : e.email] : [])).join("\n") ?? "");
  const [error, setError] = useState<string | null>(null);
  const [at, setAt] = useState<IssueLookup>(() => noIssues);
  const [busy, setBusy] = useState(false);
  const idp = list ? list.id.slice(0, 8) : "new";

  async function submit(e: SubmitEvent) {
    e.preventDefault();
    setBusy(true);
    setError(null);
    setAt(() => noIssues);
    const entries = [...roles.map((role) => ({ kind: "role", role })), ...users.map((userId) => ({ kind: "user", userId })), ...parseAddresses(addresses)];
    const body = { name, description, purpose: clerks ? "clerks" : null, entries, ...(list ? { version: list.version } : {}) };
    try {
      await apiCall(z.object({ id: z.string() }), list ? `/api/circulation/lists/${list.id}` : "/api/circulation/lists", { method: list ? "PUT" : "POST", body });
      onSaved();
    } catch (err) {
      const issues = err instanceof ApiError ? err.issues : [];
      const addressCount = roles.length + users.length;
      // An outside address's problem is shown at the addresses box, by its line there.
      setAt(() =>
        issueLookup(
          issues.map((i) => {
            const m = /^entries\.(\d+)\.email$/.exec(i.path);
            return m ? { path: "addresses", message: `Line ${Number(m[1]) - addressCount + 1}: ${i.message}` } : i;
          }),
        ),
      );
      setError((err as Error).message);
    } finally {
      setBusy(false);
    }
  }

  return (
    <form onSubmit={submit} className="space-y-3" aria-label={list ? `Edit ${list.name}` : "New distribution list"}>
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField id={`l-name-${idp}`} path="name" label="List name" at={at} value={name} onChange={setName} />
        <TextField id={`l-desc-${idp}`} path="description" label="Description" at={at} value={description} onChange={setDescription} />
      </div>
      <fieldset>
        <legend className="gw-label">Everyone holding a role</legend>
        <div className="mt-1 flex flex-wrap gap-3">
          {CHAMBER_ROLES.map((r) => (
            <label key={r} className="inline-flex items-center gap-1.5 text-sm">
              <input type="checkbox" checked={roles.includes(r)} onChange={(e) => setRoles(e.target.checked ? [...roles, r] : roles.filter((x) => x !== r))} />
              {ROLE_LABELS[r]}
            </label>
          ))}
        </div>
      </fieldset>
      <fieldset>
        <legend className="gw-label">Named people of the chamber</legend>
        <div className="mt-1 flex flex-wrap gap-3">
          {people.map((p) => (
            <label key={p.userId} className="inline-flex items-center gap-1.5 text-sm">
              <input type="checkbox" checked={users.includes(p.userId)} onChange={(e) => setUsers(e.target.checked ? [...users, p.userId] : users.filter((x) => x !== p.userId))} />
              {p.name} <span className="text-ink-soft">({isChamberRole(p.role) ? ROLE_LABELS[p.role] : p.role})</span>
            </label>
          ))}
        </div>
      </fieldset>
      <TextField
        id={`l-addr-${idp}`}
        path="addresses"
        label="Outside addresses"
        at={at}
        multiline
        rows={3}
        value={addresses}
        onChange={setAddresses}
        placeholder={"Harrowmere Courier <desk@courier.example.org>\nwire@example.org"}
        hint="One per line: an address, or a name followed by the address in angle brackets."
      />
      <label className="inline-flex items-center gap-1.5 text-sm">
        <input type="checkbox" checked={clerks} onChange={(e) => setClerks(e.target.checked)} />
        This is the clerks' list (floor-day digests go here)
      </label>
      <Alert>{error}</Alert>
      <div className="flex gap-2">
        <button type="submit" className="gw-btn" disabled={busy}>
          {list ? "Save list" : "Create list"}
        </button>
        <button type="button" className="gw-btn-quiet" onClick={onCancel}>
          Cancel
        </button>
      </div>
    </form>
  );
}

function Deliveries({ id }: { id: string }) {
  const [msgs, setMsgs] = useState<z.output<typeof messageView>[] | null>(null);
  // An answer for another item arriving late is dropped.
  useLatestAnswer(circulationDetail, { url: `/api/circulation/${id}` }, (d) => setMsgs(d.messages), () => setMsgs([]));
  if (!msgs) return <p className="text-sm text-ink-soft">Loading…</p>;
  return (
    <ul className="mt-2 space-y-1 text-sm">
      {msgs.map((m) => (
        <li key={m.id} className="flex flex-wrap items-center gap-2">
          <span className="break-all">{m.to.replace(/^"([^"]*)" </, "$1 <")}</span>
          <span className={`gw-chip ${STATUS_CHIP[m.status]}`}>{STATUS_LABEL[m.status]}</span>
          {m.lastError && m.status !== "sent" && <span className="text-xs text-ink-soft">{m.lastError}</span>}
        </li>
      ))}
    </ul>
  );
}

export default function CirculationDesk({ canEditLists, canSendDigest }: { canEditLists: boolean; canSendDigest: boolean }) {
  const [lists, setLists] = useState<ListView[] | null>(null);
  const [people, setPeople] = useState<z.output<typeof peopleView>["members"]>([]);
  const [sent, setSent] = useState<z.output<typeof circulationsView>["circulations"]>([]);
  const [editing, setEditing] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);

  async function load() {
    try {
      setLists((await apiCall(listsView, "/api/circulation/lists")).lists);
      setSent((await apiCall(circulationsView, "/api/circulation")).circulations);
    } catch (e) {
      setError((e as Error).message);
    }
  }
  useEffect(() => {
    void load();
    apiCall(peopleView, "/api/people").then((p) => setPeople(p.members), () => setPeople([]));
  }, []);
  useEffect(() => {
    if (!sent.some((c) => c.status.queued + c.status.sending > 0)) return;
    const t = setInterval(() => void load(), 3000);
    return () => clearInterval(t);
  }, [sent]);

  async function remove(l: ListView) {
    if (!confirm(`Delete the list "${l.name}"? Past sendings keep their record.`)) return;
    try {
      await apiCall(z.object({ deleted: z.string() }), `/api/circulation/lists/${l.id}`, { method: "DELETE" });
      await load();
    } catch (e) {
      setError((e as Error).message);
    }
  }

  return (
    <div className="grid gap-8 xl:grid-cols-2">
      <section aria-labelledby="lists-h">
        <div className="flex items-center justify-between gap-2">
          <h2 id="lists-h">Distribution lists</h2>
          {canEditLists && editing === null && (
            <button type="button" className="gw-btn" onClick={() => setEditing("new")}>
              New list
            </button>
          )}
        </div>
        <Alert>{error}</Alert>
        {editing === "new" && (
          <div className="gw-card mt-3">
            <ListEditor list={null} people={people} onCancel={() => setEditing(null)} onSaved={() => (setEditing(null), void load())} />
          </div>
        )}
        {lists === null ? (
          <p className="mt-3 text-ink-soft">Loading…</p>
        ) : lists.length === 0 ? (
          <p className="mt-3 text-ink-soft">No lists yet.</p>
        ) : (
          <ul className="mt-3 space-y-3">
            {lists.map((l) => (
              <li key={l.id} className="gw-card">
                {editing === l.id ? (
                  <ListEditor list={l} people={people} onCancel={() => setEditing(null)} onSaved={() => (setEditing(null), void load())} />
                ) : (
                  <>
                    <div className="flex flex-wrap items-baseline justify-between gap-2">
                      <h3>
                        {l.name}
                        {l.purpose === "clerks" && <span className="gw-chip ml-2 border-chamber bg-chamber-tint align-middle text-chamber-dark">Clerks' list</span>}
                      </h3>
                      <span className="text-sm text-ink-soft">{l.recipientCount} recipient{l.recipientCount === 1 ? "" : "s"}</span>
                    </div>
                    {l.description && <p className="mt-1 text-sm text-ink-soft">{l.description}</p>}
                    <p className="mt-2 flex flex-wrap gap-1">
                      {l.entries.map((e, i) => (
                        <span key={i} className="gw-chip border-rule text-ink">
                          {entryLabel(e)}
                        </span>
                      ))}
                    </p>
                    {canEditLists && (
                      <div className="mt-3 flex gap-2">
                        <button type="button" className="gw-btn-quiet" onClick={() => setEditing(l.id)}>
                          Edit
                        </button>
                        <button type="button" className="gw-btn-danger" onClick={() => remove(l)}>
                          Delete
                        </button>
                      </div>
                    )}
                  </>
                )}
              </li>
            ))}
          </ul>
        )}
      </section>

      <div className="space-y-8">
        {canSendDigest && (
          <section aria-labelledby="digest-h" className="gw-card">
            <h2 id="digest-h">Floor-day digest</h2>
            <p className="gw-hint">The findings and the proposed order of questions for a sitting, sent before the day's business to the clerks' list or another list you choose.</p>
            <div className="mt-3">
              <FloorDigestForm lists={lists} onSent={() => void load()} />
            </div>
          </section>
        )}
        <section aria-labelledby="sent-h">
          <h2 id="sent-h">Sent</h2>
          <p className="gw-hint">Rulings are sent from each ruling's page. Each recipient gets one message; delivery is retried until the mail server accepts it.</p>
          {sent.length === 0 ? (
            <p className="mt-3 text-ink-soft">Nothing sent yet.</p>
          ) : (
            <ul className="mt-3 space-y-3">
              {sent.map((c) => (
                <li key={c.id} className="gw-card">
                  <details>
                    <summary className="cursor-pointer">
                      <span className="font-semibold">{c.subject}</span>
                      <span className="block text-sm text-ink-soft">
                        To {c.listName} · {c.sentByName} · {when(c.createdAt)}
                      </span>
                      <span className="mt-1 flex flex-wrap gap-1">
                        {STATUSES.filter((s) => c.status[s] > 0).map((s) => (
                          <span key={s} className={`gw-chip ${STATUS_CHIP[s]}`}>
                            {c.status[s]} {STATUS_LABEL[s].toLowerCase()}
                          </span>
                        ))}
                        {c.skipped > 0 && <span className="gw-chip border-rule text-ink-soft">{c.skipped} unsubscribed</span>}
                      </span>
                    </summary>
                    {c.rulingId && (
                      <p className="mt-2 text-sm">
                        <a href={`/rulings/${c.rulingId}`}>Open the ruling</a>
                      </p>
                    )}
                    <Deliveries id={c.id} />
                  </details>
                </li>
              ))}
            </ul>
          )}
        </section>
      </div>
    </div>
  );
}
