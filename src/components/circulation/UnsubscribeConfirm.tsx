import { useState } from "react";
import { z } from "zod";
import { apiCall } from "../shared/api.ts";
import { Alert } from "../shared/Alert.tsx";

export default function UnsubscribeConfirm({ token, already }: { token: string; already: boolean }) {
  const [done, setDone] = useState(already);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  if (done)
    return (
      <Alert tone="ok" className="mt-4">
        You are unsubscribed. Later mail to this list will not be sent to this address.
      </Alert>
    );
  return (
    <div className="mt-4">
      <button
        type="button"
        className="gw-btn"
        disabled={busy}
        onClick={async () => {
          setBusy(true);
          try {
            await apiCall(z.object({ unsubscribed: z.boolean() }), "/api/circulation/unsubscribe", { method: "POST", body: { token } });
            setDone(true);
          } catch (e) {
            setError((e as Error).message);
          } finally {
            setBusy(false);
          }
        }}
      >
        Unsubscribe
      </button>
      <Alert>{error}</Alert>
    </div>
  );
}
