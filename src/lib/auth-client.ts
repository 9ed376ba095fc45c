/** better-auth's browser client, with the chamber (organization) plugin. */
import { createAuthClient } from "better-auth/react";
import { organizationClient } from "better-auth/client/plugins";

export const authClient = createAuthClient({ plugins: [organizationClient()] });
