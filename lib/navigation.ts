import { can, type Permission } from "@/lib/auth/permissions";
import type { Role } from "@/lib/auth/roles";

export interface NavItem {
  href: string;
  label: string;
  permission?: Permission;
  roles?: readonly Role[];
}

const homeLabel: Record<Role, string> = {
  admin: "Overview",
  researcher: "My trials",
  technician: "Trials I collect for",
  reviewer: "Awaiting review",
  grower: "Published results",
};

const items: NavItem[] = [
  { href: "/trials", label: "Trials", permission: "trial:list" },
  { href: "/library", label: "Library" },
  { href: "/following", label: "Following", permission: "follow:manage", roles: ["grower"] },
  { href: "/admin/users", label: "Users", permission: "user:manage" },
  { href: "/admin/mail", label: "Caught mail", permission: "mail:read-caught" },
  { href: "/admin/mail-queue", label: "Mail queue", permission: "mail:manage-queue" },
  { href: "/settings", label: "Settings", permission: "notifications:manage-own" },
];

/** The navigation a role sees; the role table decides, not the page. */
export function navigationFor(role: Role, options: { mailCatcher: boolean }): NavItem[] {
  const visible = items.filter((item) => {
    if (item.href === "/admin/mail" && !options.mailCatcher) return false;
    if (item.permission && !can(role, item.permission)) return false;
    return !item.roles || item.roles.includes(role);
  });
  return [{ href: "/", label: homeLabel[role] }, ...visible];
}
