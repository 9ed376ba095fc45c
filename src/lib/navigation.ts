/** The app's areas, and which roles see each in the navigation (pure data, shared with tests). */
import { can, type ChamberRole, type Permission } from "./permissions.ts";

export interface NavItem {
  href: string;
  label: string;
  /** Shown to roles holding this permission; every chamber role when omitted. */
  permission?: Permission;
  devOnly?: boolean;
}

export const NAV: NavItem[] = [
  { href: "/", label: "Desk" },
  { href: "/rulebooks", label: "Rulebooks" },
  { href: "/measures", label: "Measures & trees" },
  { href: "/floor", label: "The floor" },
  { href: "/orders", label: "Voting orders" },
  { href: "/rulings", label: "Rulings" },
  { href: "/circulation", label: "Circulation", permission: "circulation:send" },
  { href: "/people", label: "People", permission: "people:invite" },
  { href: "/dev/mail", label: "Caught mail", permission: "mail:view-caught", devOnly: true },
];

export function navFor(role: ChamberRole | null, dev: boolean): NavItem[] {
  if (!role) return [];
  return NAV.filter((i) => (!i.permission || can(role, i.permission)) && (!i.devOnly || dev));
}
