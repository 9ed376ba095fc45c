import { useEffect, useState, type SubmitEvent } from "react";
import { z } from "zod";
import { CHAMBER_ROLES, ROLE_LABELS, type ChamberRole } from "../../lib/permissions.ts";

const peopleSchema = z.object({
  members: z.array(z.object({ id: z.string(), userId: z.string(), name: z.string(), email: z.string(), role: z.string(), since: z.string() })),
  invitations: z.array(z.object({ id: z.string(), email: z.string(), role: z.string().nullable(), status: z.string(), expiresAt: z.string() })),
});
type People = z.infer<typeof peopleSchema>;
const errorSchema = z.object({ error: z.object({ message: z.string(), issues: z.array(z.object({ path: z.string(), message: z.string() })).optional() }) });

interface Props {
  canAdminister: boolean;
  selfUserId: string;
}

async function send(url: string, method: string, body?: unknown): Promise<{ ok: true; data: unknown } | { ok: false; message: string; fields: Record<string, string> }> {
  const res = await fetch(url, { method, headers: body ? { "content-type": "application/json" } : {}, body: body ? JSON.stringify(body) : undefined });
  const data: unknown = await res.json().catch(() => null);
  if (res.ok) return { ok: true, data };
  const e = errorSchema.safeParse(data);
  const fields: Record<string, string> = {};
  for (const i of e.success ? (e.data.error.issues ?? []) : []) fields[i.path] ??= i.message;
  return { ok: false, message: e.success ? e.data.error.message : `The server answered ${res.status}.`, fields };
}

function roleLabel(role: string | null): string {
  return role && (CHAMBER_ROLES as readonly string[]).includes(role) ? ROLE_LABELS[role as ChamberRole] : (role ?? "—");
}

export default function PeopleDesk({ canAdminister, selfUserId }: Props) {
  const [people, setPeople] = useState<People | null>(null);
  const [status, setStatus] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [fields, setFields] = useState<Record<string, string>>({});

  async function load() {
    const res = await fetch("/api/people");
    const parsed = peopleSchema.safeParse(await res.json().catch(() => null));
    if (!res.ok || !parsed.success) return setError("Could not load the chamber's people.");
    setPeople(parsed.data);
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
    const r = await send("/api/people/invitations", "POST", data);
    if (!r.ok) {
      setFields(r.fields);
      return setError(r.message);
    }
    setFields({});
    form.reset();
    setStatus(`Invitation sent to ${String(data.email)}.`);
    await load();
  }

  async function onRole(memberId: string, role: string, name: string) {
    setStatus(null);
    setError(null);
    const r = await send(`/api/people/members/${memberId}`, "PATCH", { role });
    if (!r.ok) setError(r.message);
    else setStatus(`${name} is now ${roleLabel(role)}.`);
    await load();
  }

  async function onCancel(id: string, email: string) {
    const r = await send(`/api/people/invitations/${id}`, "DELETE");
    if (!r.ok) setError(r.message);
    else setStatus(`Invitation to ${email} cancelled.`);
    await load();
  }

  return (
    <div className="space-y-6">
      <div aria-live="polite">
        {status && <p className="rounded-md bg-verdict-ok-tint px-3 py-2 text-sm font-semibold text-verdict-ok">{status}</p>}
        {error && (
          <p role="alert" className="rounded-md bg-verdict-bar-tint px-3 py-2 text-sm font-semibold text-verdict-bar">
            {error}
          </p>
        )}
      </div>
      {canAdminister && (
        <form onSubmit={onInvite} className="gw-card grid gap-3 sm:grid-cols-[1fr_12rem_auto] sm:items-end" noValidate>
          <div>
            <label htmlFor="invite-email" className="gw-label">
              E-mail to invite
            </label>
            <input id="invite-email" name="email" type="email" required className="gw-input" aria-invalid={fields.email ? true : undefined} />
            {fields.email && <p className="gw-error">{fields.email}</p>}
          </div>
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
                <th scope="col">E-mail</th>
                <th scope="col">Role</th>
              </tr>
            </thead>
            <tbody>
              {people.members.map((m) => (
                <tr key={m.id}>
                  <td>{m.name}</td>
                  <td>{m.email}</td>
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
                    <td>{new Date(i.expiresAt).toLocaleDateString()}</td>
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
