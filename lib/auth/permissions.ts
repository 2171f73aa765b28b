import type { Role } from "./roles";

/**
 * The single role → permission table. Route handlers, server actions, pages and the
 * navigation all ask this table; nothing else decides what a role may do.
 *
 * Permissions marked "trial" are also limited to trials the user belongs to: admins see
 * every trial, researchers the trials they own, technicians and reviewers the trials they
 * are members of (see lib/auth/trial-access.ts).
 */
export const permissions = {
  "user:manage": { scope: "global", roles: ["admin"] },
  "mail:read-caught": { scope: "global", roles: ["admin"] },
  "mail:manage-queue": { scope: "global", roles: ["admin"] },
  "notifications:manage-own": { scope: "global", roles: ["admin", "researcher", "technician", "reviewer", "grower"] },
  "trial:create": { scope: "global", roles: ["admin", "researcher"] },
  "trial:list": { scope: "global", roles: ["admin", "researcher", "technician", "reviewer"] },
  "site:manage": { scope: "global", roles: ["admin", "researcher"] },
  "published:read": { scope: "global", roles: ["admin", "researcher", "technician", "reviewer", "grower"] },
  "follow:manage": { scope: "global", roles: ["grower", "researcher", "reviewer", "admin"] },
  "trial:read": { scope: "trial", roles: ["admin", "researcher", "technician", "reviewer"] },
  "trial:edit": { scope: "trial", roles: ["admin", "researcher"] },
  "trial:randomize": { scope: "trial", roles: ["admin", "researcher"] },
  "trial:change-status": { scope: "trial", roles: ["admin", "researcher"] },
  "trial:manage-team": { scope: "trial", roles: ["admin", "researcher"] },
  "observation:write": { scope: "trial", roles: ["admin", "researcher", "technician"] },
  "upload:create": { scope: "trial", roles: ["admin", "researcher", "technician"] },
  "analysis:read": { scope: "trial", roles: ["admin", "researcher", "technician", "reviewer"] },
  "review:request": { scope: "trial", roles: ["admin", "researcher"] },
  "review:comment": { scope: "trial", roles: ["admin", "researcher", "reviewer"] },
  "review:approve": { scope: "trial", roles: ["admin", "reviewer"] },
  "audit:read": { scope: "trial", roles: ["admin", "researcher", "reviewer"] },
  "summary:edit": { scope: "trial", roles: ["admin", "researcher"] },
  "trial:publish": { scope: "trial", roles: ["admin", "researcher"] },
} as const satisfies Record<string, { scope: "global" | "trial"; roles: readonly Role[] }>;

export type Permission = keyof typeof permissions;

export function can(role: Role, permission: Permission): boolean {
  return (permissions[permission].roles as readonly Role[]).includes(role);
}

export function isTrialScoped(permission: Permission): boolean {
  return permissions[permission].scope === "trial";
}
