/// <reference types="astro/client" />
import type { AuthSession } from "./lib/server/auth.ts";
import type { ChamberRole } from "./lib/permissions.ts";

declare global {
  namespace App {
    interface Locals {
      user: AuthSession["user"] | null;
      session: AuthSession["session"] | null;
      /** The chamber the user is working in (their active organization), if any. */
      chamber: { id: string; name: string; slug: string; timeZone: string } | null;
      /** The user's role in `chamber`. */
      role: ChamberRole | null;
      /** Every chamber the user belongs to, for the switcher. */
      chambers: Array<{ id: string; name: string; slug: string; timeZone: string; role: ChamberRole }>;
      /** Per-request nonce for the content security policy. */
      requestId: string;
      /** Set by `answerPage` (page-guard.ts) before rendering /404 in place: what to tell the reader. */
      pageAnswer?: { status: number; title: string; message: string; back?: { href: string; label: string } };
      /** The TCP peer of the connection, set by scripts/serve.mjs (never from a header). */
      peerAddress?: string;
    }
  }
}
export {};
