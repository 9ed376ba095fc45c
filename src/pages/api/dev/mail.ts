import { desc } from "drizzle-orm";
import { db } from "../../../lib/server/db.ts";
import { caughtMail } from "../../../lib/db/schema/mail.ts";
import { GavelError } from "../../../lib/errors.ts";
import { route, requireActor } from "../../../lib/server/http.ts";

/** What the local fake SMTP server received (development only; chief clerk). */
export const GET = route(async ({ locals }) => {
  requireActor(locals, "mail:view-caught");
  if (process.env.GAVELWRIGHT_DEV_MAILBOX !== "1") throw new GavelError("not-found", "The caught-mail view exists only in development, with the local mail catcher.");
  const rows = await db.select().from(caughtMail).orderBy(desc(caughtMail.receivedAt)).limit(200);
  return { messages: rows };
});
