export const roles = ["admin", "researcher", "technician", "reviewer", "grower"] as const;
export type Role = (typeof roles)[number];

export const roleLabels: Record<Role, string> = {
  admin: "Administrator",
  researcher: "Researcher",
  technician: "Technician",
  reviewer: "Reviewer",
  grower: "Grower",
};
