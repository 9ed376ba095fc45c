import { useState, type SubmitEvent } from "react";
import { z } from "zod";
import { authClient } from "../../lib/auth-client.ts";
import { Alert } from "../shared/Alert.tsx";
import { issueLookup, TextField } from "../shared/fields.tsx";

const newChamberSchema = z.object({
  name: z.string().trim().min(3, "give the chamber's full name (at least 3 characters)").max(120),
  slug: z
    .string()
    .trim()
    .regex(/^[a-z0-9](?:[a-z0-9-]{0,38}[a-z0-9])?$/, "lower-case letters, digits and hyphens, 1–40 characters"),
});

interface Props {
  chambers: Array<{ id: string; name: string; roleLabel: string; active: boolean }>;
  /** Whether this deployment lets users register chambers (GAVELWRIGHT_OPEN_SIGNUP). */
  canRegister?: boolean;
}

/** The user's chambers: switch between them, or register a new chamber (you become its chief clerk). */
export default function ChamberDesk({ chambers, canRegister = false }: Props) {
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [busy, setBusy] = useState(false);

  async function activate(id: string) {
    setBusy(true);
    const r = await authClient.organization.setActive({ organizationId: id });
    if (r.error) {
      setErrors({ form: r.error.message ?? "Could not switch." });
      setBusy(false);
      return;
    }
    window.location.assign("/");
  }

  async function onCreate(e: SubmitEvent<HTMLFormElement>) {
    e.preventDefault();
    const parsed = newChamberSchema.safeParse(Object.fromEntries(new FormData(e.currentTarget)));
    if (!parsed.success) {
      const f: Record<string, string> = {};
      for (const i of parsed.error.issues) f[String(i.path[0])] ??= i.message;
      return setErrors(f);
    }
    setErrors({});
    setBusy(true);
    const r = await authClient.organization.create({ name: parsed.data.name, slug: parsed.data.slug });
    if (r.error || !r.data) {
      setBusy(false);
      return setErrors(/slug/i.test(r.error?.message ?? "") || r.error?.status === 400 ? { slug: "That short name is taken; choose another." } : { form: r.error?.message ?? "Could not create the chamber." });
    }
    await authClient.organization.setActive({ organizationId: r.data.id });
    window.location.assign("/people");
  }

  const at = issueLookup(Object.entries(errors).map(([path, message]) => ({ path, message })));
  return (
    <div className="space-y-8">
      <section>
        <h2 className="mb-2">Your chambers</h2>
        {chambers.length === 0 ? (
          <p className="text-ink-soft">
            You do not belong to a chamber yet. Open the invitation link you received by e-mail{canRegister ? ", or register a new chamber below" : "; new chambers are registered by whoever runs this Gavelwright"}.
          </p>
        ) : (
          <ul className="space-y-2">
            {chambers.map((c) => (
              <li key={c.id} className="gw-card flex items-center justify-between gap-3">
                <span>
                  <strong>{c.name}</strong> <span className="text-ink-soft">· {c.roleLabel}</span>
                </span>
                {c.active ? (
                  <span className="gw-chip border-chamber text-chamber">Working here</span>
                ) : (
                  <button type="button" className="gw-btn-quiet" disabled={busy} onClick={() => activate(c.id)}>
                    Work in this chamber
                  </button>
                )}
              </li>
            ))}
          </ul>
        )}
      </section>
      {canRegister && (
      <section>
        <h2 className="mb-2">Register a new chamber</h2>
        <form onSubmit={onCreate} noValidate className="gw-card space-y-3">
          <TextField id="c-name" path="name" name="name" label="Full name" at={at} />
          <TextField
            id="c-slug"
            path="slug"
            name="slug"
            label="Short name"
            at={at}
            hint={
              <>
                Used in links, e.g. <code>north-vale-council</code>.
              </>
            }
          />
          <Alert>{errors.form}</Alert>
          <button type="submit" className="gw-btn" disabled={busy}>
            Register chamber
          </button>
          <p className="gw-hint">You become its chief clerk and can then invite the others.</p>
        </form>
      </section>
      )}
    </div>
  );
}
