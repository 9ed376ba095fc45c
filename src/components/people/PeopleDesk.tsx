import { useEffect, useState, type SubmitEvent } from "react";
import { z } from "zod";
import { CHAMBER_ROLES, ROLE_LABELS, type ChamberRole } from "../../lib/permissions.ts";
import { Alert, errorText } from "../shared/Alert.tsx";
import { apiCall } from "../shared/api.ts";
import { day } from "../shared/dates.ts";
import { issueLookup, noIssues, TextField, type IssueLookup } from "../shared/fields.tsx";
import { ConfirmDialog } from "../shared/ConfirmDialog.tsx";
import { TableHead } from "../shared/TableHead.tsx";

const peopleSchema = z.object({
  members: z.array(z.object({ id: z.string(), userId: z.string(), name: z.string(), email: z.string().nullable(), role: z.string(), since: z.string() })),
  invitations: z.array(z.object({ id: z.string(), email: z.string(), role: z.string().nullable(), status: z.string(), expiresAt: z.string() })),
});
type People = z.infer<typeof peopleSchema>;
const removedSchema = z.object({ removed: z.array(z.object({ userId: z.string(), name: z.string(), role: z.string(), removedAt: z.string(), removedBy: z.string() })) });
type Removed = z.infer<typeof removedSchema>["removed"];

/** A change waiting for the chief clerk's confirmation. */
type Pending =
  | { kind: "role"; memberId: string; name: string; from: string; to: string }
  | { kind: "remove"; memberId: string; name: string; role: string }
  | { kind: "restore"; userId: string; name: string; role: string }
  | { kind: "cancel"; invitationId: string; email: string };

interface Props {
  canAdminister: boolean;
  /** Whether the e-mail column is shown (the server sends addresses only to those who may see them). */
  showEmail: boolean;
  selfUserId: string;
}

/** What the people routes answer to a change: nothing the desk reads (it reloads the list). */
const anyAnswer = z.unknown();

function roleLabel(role: string | null): string {
  return role && (CHAMBER_ROLES as readonly string[]).includes(role) ? ROLE_LABELS[role as ChamberRole] : (role ?? "—");
}

/** For each change: what the dialog asks and says, its button, the request, and what the desk says once done. */
function change(p: Pending): { title: string; says: string; confirm: string; danger: boolean; path: string; method: "PATCH" | "DELETE" | "POST"; send?: unknown; done: string; keep?: string; button?: string; buttonLabel?: string } {
  switch (p.kind) {
    case "role":
      return {
        title: `Make ${p.name} ${roleLabel(p.to)}?`,
        says: `${p.name} goes from ${roleLabel(p.from)} to ${roleLabel(p.to)} at once, with what that role may do. This cannot be undone: changing it back is a new change, and both stay in the people log with your name.`,
        confirm: "Change the role",
        danger: true,
        path: `/api/people/members/${p.memberId}`,
        method: "PATCH",
        send: { role: p.to },
        done: `${p.name} is now ${roleLabel(p.to)}. The change is in the people log.`,
      };
    case "remove":
      return {
        title: `Remove ${p.name} from the chamber?`,
        says: `${p.name} (${roleLabel(p.role)}) loses access to the chamber at once. The removal cannot be undone: it stays in the people log with your name. You can restore ${p.name} later from this page, with the same role.`,
        confirm: "Remove",
        button: "Remove…",
        buttonLabel: `Remove ${p.name}…`,
        danger: true,
        path: `/api/people/members/${p.memberId}`,
        method: "DELETE",
        done: `${p.name} was removed from the chamber. The removal is in the people log.`,
      };
    case "restore":
      return {
        title: `Restore ${p.name} as ${roleLabel(p.role)}?`,
        says: `${p.name} gets access to the chamber again at once. The restoration is recorded in the people log with your name.`,
        confirm: "Restore",
        button: "Restore…",
        buttonLabel: `Restore ${p.name}…`,
        danger: false,
        path: `/api/people/removed/${p.userId}`,
        method: "POST",
        done: `${p.name} is back in the chamber as ${roleLabel(p.role)}.`,
      };
    case "cancel":
      return {
        title: `Cancel the invitation to ${p.email}?`,
        says: `The link sent to ${p.email} stops working at once; this cannot be undone. To let them in later, send a new invitation.`,
        confirm: "Cancel the invitation",
        keep: "Keep it",
        button: "Cancel…",
        buttonLabel: `Cancel the invitation to ${p.email}…`,
        danger: true,
        path: `/api/people/invitations/${p.invitationId}`,
        method: "DELETE",
        done: `Invitation to ${p.email} cancelled.`,
      };
  }
}

/** The row's button that asks for a change (the dialog then names it), labelled with whom it concerns. A role is changed from its select instead. */
function AskButton({ change: p, onAsk }: { change: Exclude<Pending, { kind: "role" }>; onAsk: (p: Pending) => void }) {
  const c = change(p);
  return (
    <button type="button" className="gw-btn-quiet" aria-label={c.buttonLabel} onClick={() => onAsk(p)}>
      {c.button}
    </button>
  );
}

export default function PeopleDesk({ canAdminister, showEmail, selfUserId }: Props) {
  const [people, setPeople] = useState<People | null>(null);
  const [status, setStatus] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [fields, setFields] = useState<IssueLookup>(() => noIssues);
  const [removed, setRemoved] = useState<Removed>([]);
  const [pending, setPending] = useState<Pending | null>(null);
  const [busy, setBusy] = useState(false);
  const [refusal, setRefusal] = useState<string | null>(null);

  async function load() {
    try {
      setPeople(await apiCall(peopleSchema, "/api/people"));
      if (canAdminister) setRemoved((await apiCall(removedSchema, "/api/people/removed")).removed);
    } catch {
      setError("Could not load the chamber's people.");
    }
  }
  useEffect(() => {
    void load();
  }, []);

  async function onInvite(e: SubmitEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = e.currentTarget;
    const data = Object.fromEntries(new FormData(form));
    setStatus(null);
    setError(null);
    try {
      await apiCall(anyAnswer, "/api/people/invitations", { method: "POST", body: data });
    } catch (err) {
      setFields(() => issueLookup(err));
      return setError(errorText(err, "The invitation was not sent."));
    }
    setFields(() => noIssues);
    form.reset();
    setStatus(`Invitation sent to ${String(data.email)}.`);
    await load();
  }

  function ask(p: Pending) {
    setStatus(null);
    setError(null);
    setRefusal(null);
    setPending(p);
  }

  /** Do the confirmed change; a refusal stays in the dialog, success closes it and says what happened. */
  async function onConfirmed() {
    if (!pending) return;
    setBusy(true);
    setRefusal(null);
    try {
      const c = change(pending);
      await apiCall(anyAnswer, c.path, { method: c.method, ...(c.send === undefined ? {} : { body: c.send }) });
      setPending(null);
      await load();
      setStatus(c.done);
    } catch (err) {
      setRefusal(errorText(err, "Nothing was changed."));
    } finally {
      setBusy(false);
    }
  }

  const asked = pending && change(pending);
  return (
    <div className="space-y-6">
      <div aria-live="polite">
        <Alert tone="ok" look="box">{status}</Alert>
        <Alert look="box">{error}</Alert>
      </div>
      {canAdminister && (
        <form onSubmit={onInvite} className="gw-card grid gap-3 sm:grid-cols-[1fr_12rem_auto] sm:items-end" noValidate>
          <TextField id="invite-email" path="email" name="email" type="email" label="E-mail to invite" at={fields} />
          <div>
            <label htmlFor="invite-role" className="gw-label">
              Role
            </label>
            <select id="invite-role" name="role" className="gw-input" defaultValue="member">
              {CHAMBER_ROLES.map((r) => (
                <option key={r} value={r}>
                  {ROLE_LABELS[r]}
                </option>
              ))}
            </select>
          </div>
          <button type="submit" className="gw-btn">
            Send invitation
          </button>
        </form>
      )}
      <section>
        <h2 className="mb-2">People with access</h2>
        {!people ? (
          <p className="text-ink-soft">Loading…</p>
        ) : (
          <div className="relative overflow-x-auto">
          <table className="gw-table">
            <TableHead columns={["Name", showEmail && "E-mail", "Role"]} actions={canAdminister} />
            <tbody>
              {people.members.map((m) => (
                <tr key={m.id}>
                  <td>{m.name}</td>
                  {showEmail && <td>{m.email}</td>}
                  <td>
                    {canAdminister && m.userId !== selfUserId ? (
                      <select aria-label={`Role of ${m.name}`} className="rounded-md border border-rule bg-white px-2 py-1" value={m.role} onChange={(e) => ask({ kind: "role", memberId: m.id, name: m.name, from: m.role, to: e.target.value })}>
                        {CHAMBER_ROLES.map((r) => (
                          <option key={r} value={r}>
                            {ROLE_LABELS[r]}
                          </option>
                        ))}
                      </select>
                    ) : (
                      roleLabel(m.role)
                    )}
                  </td>
                  {canAdminister && (
                    <td>
                      {m.userId !== selfUserId && (
                        <AskButton change={{ kind: "remove", memberId: m.id, name: m.name, role: m.role }} onAsk={ask} />
                      )}
                    </td>
                  )}
                </tr>
              ))}
            </tbody>
          </table>
          </div>
        )}
      </section>
      {canAdminister && removed.length > 0 && (
        <section>
          <h2 className="mb-2">Removed from the chamber</h2>
          <table className="gw-table" data-testid="removed-people">
            <TableHead columns={["Name", "Role held", "Removed"]} actions />
            <tbody>
              {removed.map((r) => (
                <tr key={r.userId}>
                  <td>{r.name}</td>
                  <td>{roleLabel(r.role)}</td>
                  <td>{day(r.removedAt)}, by {r.removedBy}</td>
                  <td>
                    <AskButton change={{ kind: "restore", userId: r.userId, name: r.name, role: r.role }} onAsk={ask} />
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </section>
      )}
      {canAdminister && (
        <p>
          <a className="underline" href="/people/log">
            People log: who changed which role, removed or restored whom, and when
          </a>
        </p>
      )}
      <ConfirmDialog
        open={asked !== null}
        testId="people-confirm"
        title={asked?.title ?? ""}
        confirm={asked?.confirm ?? ""}
        cancel={asked?.keep}
        danger={asked?.danger}
        busy={busy}
        error={refusal}
        onConfirm={() => void onConfirmed()}
        onCancel={() => setPending(null)}
      >
        {asked && <p>{asked.says}</p>}
      </ConfirmDialog>
      {canAdminister && people && (
        <section>
          <h2 className="mb-2">Pending invitations</h2>
          {people.invitations.length === 0 ? (
            <p className="text-ink-soft">None.</p>
          ) : (
            <table className="gw-table">
              <TableHead columns={["E-mail", "Role", "Expires"]} actions />
              <tbody>
                {people.invitations.map((i) => (
                  <tr key={i.id}>
                    <td>{i.email}</td>
                    <td>{roleLabel(i.role)}</td>
                    <td>{day(i.expiresAt)}</td>
                    <td>
                      <AskButton change={{ kind: "cancel", invitationId: i.id, email: i.email }} onAsk={ask} />
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
        </section>
      )}
    </div>
  );
}
