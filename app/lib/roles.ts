// Roles within an organisation and what each may do. Pure: used by server guards and by the UI.
export const ROLES = ["admin", "designer", "reviewer", "editor"] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  admin: "Admin",
  designer: "Designer",
  reviewer: "Reviewer",
  editor: "Chart editor",
};

export const ROLE_SUMMARIES: Record<Role, string> = {
  admin: "Runs the organisation: members, roles and invitations.",
  designer: "Composes exhibits: span, medium, markers, texts and images; submits them for review.",
  reviewer: "Checks every figure against the pinned chart edition; approves or asks for changes.",
  editor: "Looks after chart editions and the dated-event library; sees what an edition change affects.",
};

export function isRole(value: unknown): value is Role {
  return typeof value === "string" && (ROLES as readonly string[]).includes(value);
}
