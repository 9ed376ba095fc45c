/**
 * better-auth's organization plugin checks its own statements (invitations, member roles)
 * against roles defined here. They are derived from ROLE_PERMISSIONS so that there is one
 * source of truth for who may do what.
 */
import { createAccessControl } from "better-auth/plugins/access";
import { defaultStatements } from "better-auth/plugins/organization/access";
import { can, CHAMBER_ROLES, type ChamberRole } from "../permissions.ts";

export const ac = createAccessControl({ ...defaultStatements });

function statementsFor(role: ChamberRole) {
  const admin = can(role, "people:assign-role");
  const invite = can(role, "people:invite");
  return {
    organization: admin ? (["update"] as const) : ([] as const),
    member: admin ? (["create", "update", "delete"] as const) : ([] as const),
    invitation: invite ? (["create", "cancel"] as const) : ([] as const),
    team: [] as const,
    ac: admin ? (["read"] as const) : ([] as const),
  };
}

export const roles = Object.fromEntries(CHAMBER_ROLES.map((r) => [r, ac.newRole(statementsFor(r) as never)])) as Record<ChamberRole, ReturnType<typeof ac.newRole>>;
