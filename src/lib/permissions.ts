/**
 * Chamber roles and what each may do: typed data checked by one function, `can`,
 * used by the pages (to hide what a user cannot do) and by the server (to refuse it).
 * Pure: no I/O, safe to import in the browser.
 */

export const CHAMBER_ROLES = ["chief-clerk", "clerk", "member", "staff", "observer"] as const;
export type ChamberRole = (typeof CHAMBER_ROLES)[number];

export const ROLE_LABELS: Record<ChamberRole, string> = {
  "chief-clerk": "Chief clerk",
  clerk: "Clerk",
  member: "Member",
  staff: "Staff",
  observer: "Observer",
};

export const ROLE_DUTIES: Record<ChamberRole, string> = {
  "chief-clerk": "Administers the chamber: invites people and assigns roles; can do everything a clerk does.",
  clerk: "Keeps rulebooks, measures and amendment trees; records the floor; drafts and issues rulings.",
  member: "Files amendments, asks which motions are in order, views trees and analyses.",
  staff: "Circulates rulings and keeps distribution lists.",
  observer: "Reads everything shared with the chamber; changes nothing.",
};

export const PERMISSIONS = [
  "chamber:read",
  "people:invite",
  "people:assign-role",
  "rulebook:edit",
  "rulebook:adopt",
  "measure:edit",
  "amendment:file",
  "tree:override",
  "floor:record",
  "estimate:create",
  "ruling:draft",
  "ruling:issue",
  "circulation:send",
  "lists:edit",
  "mail:view-caught",
  /** See colleagues' e-mail addresses (people page and every API that lists people; staff see the addresses their circulations go to, which is their work). */
  "people:see-email",
  /** Cancel any analysis run of the chamber, not only one's own (the worker pool is shared). */
  "analysis:cancel-any",
] as const;
export type Permission = (typeof PERMISSIONS)[number];

/** What only the chief clerk may do; a clerk may do everything else. */
const CHIEF_CLERK_ONLY: readonly Permission[] = ["people:invite", "people:assign-role", "mail:view-caught"];
const CLERK: Permission[] = PERMISSIONS.filter((p) => !CHIEF_CLERK_ONLY.includes(p));

export const ROLE_PERMISSIONS: Record<ChamberRole, readonly Permission[]> = {
  "chief-clerk": PERMISSIONS,
  clerk: CLERK,
  member: ["chamber:read", "amendment:file", "estimate:create"],
  staff: ["chamber:read", "circulation:send", "lists:edit", "estimate:create"],
  observer: ["chamber:read"],
};

export function isChamberRole(value: unknown): value is ChamberRole {
  return typeof value === "string" && (CHAMBER_ROLES as readonly string[]).includes(value);
}

/** The one permission check. A missing or unknown role may do nothing. */
export function can(role: string | null | undefined, permission: Permission): boolean {
  return isChamberRole(role) && ROLE_PERMISSIONS[role].includes(permission);
}
