// The development mail catcher: a fake SMTP server on 127.0.0.1 that stores what it receives
// in the caught_mail table, shown to the chief clerk at /dev/mail. Started by `npm start`.
import postgres from "postgres";
import { startMailCatcher } from "../src/lib/server/dev/mail-catcher.ts";

const url = process.env.DATABASE_URL;
if (!url) throw new Error("DATABASE_URL is not set");
const sql = postgres(url, { max: 2, onnotice: () => {} });
const port = Number(process.env.SMTP_PORT ?? 2525);
const catcher = await startMailCatcher({
  port,
  async onMessage(m) {
    await sql`INSERT INTO caught_mail (message_id, "from", "to", subject, text, html) VALUES (${m.messageId}, ${m.from}, ${m.to}, ${m.subject}, ${m.text}, ${m.html})`;
    console.log(`[mail-catcher] ${m.to}: ${m.subject}`);
  },
});
console.log(`[mail-catcher] fake SMTP server listening on 127.0.0.1:${catcher.port}`);
const stop = async () => {
  await catcher.close();
  await sql.end();
  process.exit(0);
};
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
