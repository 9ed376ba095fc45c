import { useState } from "react";
import { z } from "zod";
import { api } from "../rulings/api.ts";

export default function UnsubscribeConfirm({ token, already }: { token: string; already: boolean }) {
  const [done, setDone] = useState(already);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  if (done)
    return (
      <p role="status" className="mt-4 font-semibold text-verdict-ok">
        You are unsubscribed. Later mail to this list will not be sent to this address.
      </p>
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
            await api("/api/circulation/unsubscribe", z.object({ unsubscribed: z.boolean() }), { method: "POST", body: { token } });
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
      {error && (
        <p role="alert" className="gw-error">
          {error}
        </p>
      )}
    </div>
  );
}
