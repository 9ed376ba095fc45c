/**
 * better-auth's organization plugin checks its own statements (invitations, member roles)
 * against roles defined here. They are derived from ROLE_PERMISSIONS so that there is one
 * source of truth for who may do what.
 */
import { createAccessControl } from "better-auth/plugins/access";
import { defaultStatements } from "better-auth/plugins/organization/access";
import { can, type ChamberRole } from "../permissions.ts";

export const ac = createAccessControl({ ...defaultStatements });

type Statements = Parameters<typeof ac.newRole>[0];

function statementsFor(role: ChamberRole): Statements {
  const admin = can(role, "people:assign-role");
  const invite = can(role, "people:invite");
  return {
    organization: admin ? ["update"] : [],
    member: admin ? ["create", "update", "delete"] : [],
    invitation: invite ? ["create", "cancel"] : [],
    team: [],
    ac: admin ? ["read"] : [],
  };
}

export const roles = {
  "chief-clerk": ac.newRole(statementsFor("chief-clerk")),
  clerk: ac.newRole(statementsFor("clerk")),
  member: ac.newRole(statementsFor("member")),
  staff: ac.newRole(statementsFor("staff")),
  observer: ac.newRole(statementsFor("observer")),
} satisfies Record<ChamberRole, unknown>;
