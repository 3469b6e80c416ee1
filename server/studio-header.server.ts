// What the site header shows a signed-in person, on studio pages and on the chart-edition pages
// alike (one navigation for both): who they are, their organisations and which sections they may open.
import { can } from "../app/lib/permissions.ts";
import { rolesInWords } from "../app/lib/roles.ts";
import type { StudioHeaderData } from "../app/lib/site-header.ts";
import type { Signed } from "./auth.server.ts";

export function studioHeaderOf(s: Signed): StudioHeaderData {
  const subject = s.subject;
  return {
    user: { name: s.user.name, email: s.user.email },
    organisation: s.organisation ? { id: s.organisation.id, name: s.organisation.name } : null,
    roles: rolesInWords(s.roles) || (subject.steward ? "Chart steward" : ""),
    steward: subject.steward,
    organisations: s.memberships.map((m) => ({ id: m.organisationId, name: m.organisation!.name, roles: rolesInWords(m.roles, { lower: true }) })),
    may: {
      member: s.membership !== null,
      team: can(subject, "members.manage"),
      editions: can(subject, "edition.import") || can(subject, "edition.set-current") || can(subject, "edition.manage-shared"),
      importEditions: can(subject, "edition.import") || can(subject, "edition.manage-shared"),
    },
  };
}
