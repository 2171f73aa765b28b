import { describe, expect, it } from "vitest";
import { can, permissions, type Permission } from "@/lib/auth/permissions";
import { roles, type Role } from "@/lib/auth/roles";

// What each role may do, written out from the product's role descriptions rather than read
// back from the table: researchers plan and own trials, technicians collect, reviewers read
// and approve analyses, growers read published results, admins run the installation.
const allowed: Record<Role, Permission[]> = {
  admin: Object.keys(permissions) as Permission[],
  researcher: [
    "trial:create", "trial:list", "site:manage", "published:read", "follow:manage", "trial:read", "trial:edit",
    "trial:randomize", "trial:change-status", "trial:manage-team", "observation:write", "upload:create",
    "analysis:read", "review:request", "review:comment", "audit:read", "summary:edit", "trial:publish",
    "notifications:manage-own",
  ],
  technician: ["trial:list", "published:read", "trial:read", "observation:write", "upload:create", "analysis:read", "notifications:manage-own"],
  reviewer: ["trial:list", "published:read", "follow:manage", "trial:read", "analysis:read", "review:comment", "review:approve", "audit:read", "notifications:manage-own"],
  grower: ["published:read", "follow:manage", "notifications:manage-own"],
};

describe("role → permission table", () => {
  for (const role of roles) {
    for (const permission of Object.keys(permissions) as Permission[]) {
      const expected = allowed[role].includes(permission);
      it(`${role} ${expected ? "may" : "may not"} ${permission}`, () => {
        expect(can(role, permission)).toBe(expected);
      });
    }
  }

  it("keeps the decisive separations of duty", () => {
    expect(can("researcher", "review:approve")).toBe(false);
    expect(can("technician", "trial:randomize")).toBe(false);
    expect(can("technician", "trial:create")).toBe(false);
    expect(can("grower", "upload:create")).toBe(false);
    expect(can("reviewer", "observation:write")).toBe(false);
  });
});
