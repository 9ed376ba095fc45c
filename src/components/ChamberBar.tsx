import { useState } from "react";
import { authClient } from "../lib/auth-client.ts";
import { Alert } from "./shared/Alert.tsx";

interface Props {
  chambers: Array<{ id: string; name: string; role: string }>;
  activeId: string | null;
  userName: string;
}

/** Chamber switcher and sign-out, in the top bar. */
export default function ChamberBar({ chambers, activeId, userName }: Props) {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  async function switchTo(id: string) {
    setBusy(true);
    setError(null);
    const r = await authClient.organization.setActive({ organizationId: id });
    if (r.error) {
      setError(r.error.message ?? "Could not switch chamber.");
      setBusy(false);
      return;
    }
    window.location.assign("/");
  }

  async function signOut() {
    setBusy(true);
    await authClient.signOut();
    window.location.assign("/sign-in");
  }

  return (
    <div className="flex flex-wrap items-center gap-3 text-sm">
      {chambers.length > 0 && (
        <label className="flex items-center gap-2">
          <span className="font-semibold text-white/90">Chamber</span>
          <select
            className="rounded-md border border-white/40 bg-chamber-dark px-2 py-1 text-white"
            value={activeId ?? ""}
            disabled={busy || chambers.length < 2}
            onChange={(e) => switchTo(e.target.value)}
          >
            {chambers.map((c) => (
              <option key={c.id} value={c.id}>
                {c.name}
              </option>
            ))}
          </select>
        </label>
      )}
      <span className="text-white/90" data-testid="signed-in-as">{userName}</span>
      <button type="button" onClick={signOut} disabled={busy} className="rounded-md border border-white/50 px-2 py-1 font-semibold text-white hover:bg-white/10">
        Sign out
      </button>
      <Alert look="on-dark">{error}</Alert>
    </div>
  );
}
