import { useState } from "react";
import { authClient } from "../../lib/auth-client.ts";
import { Alert } from "../shared/Alert.tsx";

export default function AcceptInvitation({ invitationId, chamber }: { invitationId: string; chamber: string }) {
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function act(accept: boolean) {
    setBusy(true);
    setError(null);
    const r = accept ? await authClient.organization.acceptInvitation({ invitationId }) : await authClient.organization.rejectInvitation({ invitationId });
    if (r.error) {
      setBusy(false);
      return setError(r.error.status === 403 ? "This invitation was sent to another e-mail address. Sign in with that address to accept it." : "This invitation can no longer be used: it expired, was cancelled or was already answered. Ask the chief clerk for a new one.");
    }
    window.location.assign(accept ? "/" : "/chambers");
  }

  return (
    <div className="flex flex-wrap items-center gap-3">
      <button type="button" className="gw-btn" disabled={busy} onClick={() => act(true)}>
        Join {chamber}
      </button>
      <button type="button" className="gw-btn-quiet" disabled={busy} onClick={() => act(false)}>
        Decline
      </button>
      <Alert className="w-full">{error}</Alert>
    </div>
  );
}
