import { STATUS_CHIP, STATUS_LABEL, type MessageView } from "../rulings/api.ts";

/** Each recipient of one sending and how its delivery stands; a failed or uncertain one can be sent again. */
export default function DeliveryTable({ testId, messages, skipped, onRetry, busy }: { testId: string; messages: MessageView[]; skipped: Array<{ email: string }>; onRetry: (messageId: string) => void; busy?: boolean }) {
  return (
    <table className="gw-table mt-2" data-testid={testId}>
      <thead>
        <tr>
          <th scope="col">Recipient</th>
          <th scope="col">Status</th>
        </tr>
      </thead>
      <tbody>
        {messages.map((m) => (
          <tr key={m.id}>
            <td className="break-all">{m.to.replace(/^"([^"]*)" </, "$1 <")}</td>
            <td>
              <span className={`gw-chip ${STATUS_CHIP[m.status]}`}>{STATUS_LABEL[m.status]}</span>
              {m.attempts > 1 && <span className="block text-xs text-ink-soft">{m.attempts} attempts</span>}
              {m.lastError && m.status !== "sent" && <span className="block text-xs text-ink-soft">{m.lastError}</span>}
              {(m.status === "failed" || m.status === "uncertain") && (
                <button type="button" className="gw-btn-quiet mt-1" onClick={() => onRetry(m.id)} disabled={busy}>
                  Send again
                </button>
              )}
            </td>
          </tr>
        ))}
        {skipped.map((x) => (
          <tr key={x.email}>
            <td className="break-all">{x.email}</td>
            <td>
              <span className="gw-chip border-rule text-ink-soft">Unsubscribed — not sent</span>
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
