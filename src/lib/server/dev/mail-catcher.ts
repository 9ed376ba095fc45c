/**
 * A local fake SMTP server (development and tests only): accepts every message on loopback
 * and hands it, parsed, to `onMessage`. Stands in for a real SMTP relay.
 */
import { SMTPServer } from "smtp-server";
import { simpleParser, type ParsedMail } from "mailparser";

export interface CaughtMessage {
  messageId: string | null;
  from: string;
  to: string;
  subject: string;
  text: string | null;
  html: string | null;
  parsed: ParsedMail;
}

export interface MailCatcher {
  port: number;
  close(): Promise<void>;
}

function addressText(a: ParsedMail["to"] | ParsedMail["from"]): string {
  if (!a) return "";
  return (Array.isArray(a) ? a : [a]).map((x) => x.text).join(", ");
}

export function startMailCatcher(opts: { port: number; host?: string; onMessage: (m: CaughtMessage) => Promise<void> | void }): Promise<MailCatcher> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    logger: false,
    size: 10 * 1024 * 1024,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          await opts.onMessage({
            messageId: parsed.messageId ?? null,
            from: addressText(parsed.from),
            to: addressText(parsed.to),
            subject: parsed.subject ?? "",
            text: parsed.text ?? null,
            html: typeof parsed.html === "string" ? parsed.html : null,
            parsed,
          });
          callback();
        })
        .catch((e: Error) => callback(e));
    },
  });
  return new Promise((resolve, reject) => {
    server.once("error", reject);
    server.listen(opts.port, opts.host ?? "127.0.0.1", () => {
      const addr = server.server.address();
      const port = typeof addr === "object" && addr ? addr.port : opts.port;
      resolve({ port, close: () => new Promise<void>((r) => server.close(() => r())) });
    });
  });
}
