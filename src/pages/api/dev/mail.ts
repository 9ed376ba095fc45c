import { GavelError } from "../../../lib/errors.ts";
import { route, requireActor } from "../../../lib/server/http.ts";
import { listCaughtMail } from "../../../lib/server/mail.ts";

export const prerender = false;

/** What the local fake SMTP server received (development only; chief clerk). */
export const GET = route(async ({ locals }) => {
  const actor = requireActor(locals, "mail:view-caught");
  if (process.env.GAVELWRIGHT_DEV_MAILBOX !== "1") throw new GavelError("not-found", "The caught-mail view exists only in development, with the local mail catcher.");
  return { messages: await listCaughtMail(actor.chamber.id) };
});
