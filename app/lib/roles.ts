// Roles within an organisation. A membership holds a set of them (never empty): a small museum's
// curator may be designer and reviewer at once. Pure: used by server guards and by the UI. What each
// role may do is decided in one place, app/lib/permissions.ts.
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

/** A role set in the canonical order of ROLES, without repeats (how it is stored and shown). */
export function normaliseRoles(roles: Iterable<Role>): Role[] {
  const set = new Set(roles);
  return ROLES.filter((r) => set.has(r));
}

/** "Designer and reviewer" — a role set in words, for pages and e-mails. */
export function rolesInWords(roles: readonly Role[], opts: { lower?: boolean } = {}): string {
  const words = normaliseRoles(roles).map((r, i) => (opts.lower || i > 0 ? ROLE_LABELS[r].toLowerCase() : ROLE_LABELS[r]));
  if (words.length <= 1) return words[0] ?? "";
  return `${words.slice(0, -1).join(", ")} and ${words[words.length - 1]}`;
}
