import { useEffect, useState, type SubmitEvent } from "react";
import { z } from "zod";
import { CHAMBER_ROLES, ROLE_LABELS, type ChamberRole } from "../../lib/permissions.ts";
import { Alert, errorText } from "../shared/Alert.tsx";
import { apiCall } from "../shared/api.ts";
import { day } from "../shared/dates.ts";
import { issueLookup, noIssues, TextField, type IssueLookup } from "../shared/fields.tsx";

const peopleSchema = z.object({
  members: z.array(z.object({ id: z.string(), userId: z.string(), name: z.string(), email: z.string().nullable(), role: z.string(), since: z.string() })),
  invitations: z.array(z.object({ id: z.string(), email: z.string(), role: z.string().nullable(), status: z.string(), expiresAt: z.string() })),
});
type People = z.infer<typeof peopleSchema>;

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

export default function PeopleDesk({ canAdminister, showEmail, selfUserId }: Props) {
  const [people, setPeople] = useState<People | null>(null);
  const [status, setStatus] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [fields, setFields] = useState<IssueLookup>(() => noIssues);

  async function load() {
    try {
      setPeople(await apiCall(peopleSchema, "/api/people"));
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

  async function onRole(memberId: string, role: string, name: string) {
    setStatus(null);
    setError(null);
    try {
      await apiCall(anyAnswer, `/api/people/members/${memberId}`, { method: "PATCH", body: { role } });
      setStatus(`${name} is now ${roleLabel(role)}.`);
    } catch (err) {
      setError(errorText(err, "The role was not changed."));
    }
    await load();
  }

  async function onCancel(id: string, email: string) {
    try {
      await apiCall(anyAnswer, `/api/people/invitations/${id}`, { method: "DELETE" });
      setStatus(`Invitation to ${email} cancelled.`);
    } catch (err) {
      setError(errorText(err, "The invitation was not cancelled."));
    }
    await load();
  }

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
          <table className="gw-table">
            <thead>
              <tr>
                <th scope="col">Name</th>
                {showEmail && <th scope="col">E-mail</th>}
                <th scope="col">Role</th>
              </tr>
            </thead>
            <tbody>
              {people.members.map((m) => (
                <tr key={m.id}>
                  <td>{m.name}</td>
                  {showEmail && <td>{m.email}</td>}
                  <td>
                    {canAdminister && m.userId !== selfUserId ? (
                      <select aria-label={`Role of ${m.name}`} className="rounded-md border border-rule bg-white px-2 py-1" value={m.role} onChange={(e) => onRole(m.id, e.target.value, m.name)}>
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
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>
      {canAdminister && people && (
        <section>
          <h2 className="mb-2">Pending invitations</h2>
          {people.invitations.length === 0 ? (
            <p className="text-ink-soft">None.</p>
          ) : (
            <table className="gw-table">
              <thead>
                <tr>
                  <th scope="col">E-mail</th>
                  <th scope="col">Role</th>
                  <th scope="col">Expires</th>
                  <th scope="col">
                    <span className="sr-only">Actions</span>
                  </th>
                </tr>
              </thead>
              <tbody>
                {people.invitations.map((i) => (
                  <tr key={i.id}>
                    <td>{i.email}</td>
                    <td>{roleLabel(i.role)}</td>
                    <td>{day(i.expiresAt)}</td>
                    <td>
                      <button type="button" className="gw-btn-quiet" onClick={() => onCancel(i.id, i.email)}>
                        Cancel
                      </button>
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
