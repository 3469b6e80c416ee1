import { Link } from "react-router";
import { PageHeader } from "~/components/page-header";
import { ROLE_SUMMARIES, rolesInWords, type Role } from "~/lib/roles";
import { requireMember } from "#server/auth.server.ts";
import { studioCounts, type StudioCounts } from "#server/studio.server.ts";
import type { Route } from "./+types/home";

export const meta: Route.MetaFunction = () => [{ title: "Studio · Eonscale" }];

export async function loader({ request }: Route.LoaderArgs) {
  const member = await requireMember(request);
  const url = new URL(request.url);
  const counts = await studioCounts(member.organisation.id);
  return {
    name: member.user.name,
    organisation: member.organisation.name,
    roles: member.roles,
    welcome: url.searchParams.get("welcome") === "1",
    counts,
  };
}

interface NextStep {
  title: string;
  text: string;
  to?: string;
  cta?: string;
}

function stepsFor(role: Role, counts: StudioCounts): NextStep[] {
  switch (role) {
    case "admin":
      return [
        counts.members <= 1
          ? { title: "Invite your team", text: "Nobody else is here yet. Invite a designer to compose exhibits and a reviewer to check them.", to: "/studio/team", cta: "Invite people" }
          : { title: "Your team", text: `${counts.members} members${counts.pending ? `, ${counts.pending} invitation${counts.pending === 1 ? "" : "s"} waiting` : ""}. Change roles or invite someone new.`, to: "/studio/team", cta: "Open the team page" },
        { title: "Keep the four-eyes rule workable", text: "A reviewer cannot approve an exhibit they edited, so keep at least two people who can review." },
      ];
    case "designer":
      return [
        counts.exhibits === 0
          ? { title: "Start your first exhibit", text: "Choose a span of the timescale, a medium — a length such as a wall or rope, or a real route as GeoJSON or GPX — and place the markers.", to: "/studio/exhibits/new", cta: "New exhibit" }
          : { title: "Your exhibits", text: `${counts.exhibits} exhibit${counts.exhibits === 1 ? "" : "s"}${counts.recheck ? `, ${counts.recheck} pinned to an older chart edition and needing a re-check` : ""}.`, to: counts.recheck ? "/studio/exhibits?recheck=1" : "/studio/exhibits", cta: counts.recheck ? "See what needs re-checking" : "Open the exhibits" },
        { title: "Start another exhibit", text: "A wall, a rope, a banner, or a real route from a GPX track: the preview shows every marker's place as you type.", to: "/studio/exhibits/new", cta: "New exhibit" },
      ];
    case "reviewer":
      return [
        { title: "Exhibits of your organisation", text: `${counts.exhibits} exhibit${counts.exhibits === 1 ? "" : "s"} to read, each with its markers, sources and uncertainties${counts.recheck ? `; ${counts.recheck} pinned to an older chart edition` : ""}. Submitting and approving reviews arrives with the review workflow.`, to: "/studio/exhibits", cta: "Read the exhibits" },
      ];
    case "editor":
      return [
        { title: "Chart editions", text: "Compare editions of the International Chronostratigraphic Chart and make one current. Exhibits pinned to an older edition will be flagged for re-checking.", to: "/studio/editions", cta: "Manage chart editions" },
        { title: "Import a new edition", text: "Upload our CSV or JSON, or the ICS chart's Turtle file. You see every problem with its line before anything is saved; new imports are drafts.", to: "/studio/editions/import", cta: "Import an edition" },
        { title: "Dated-event library", text: "Events that are not boundaries — oldest mineral grains, first land plants — each with age, uncertainty and citation.", to: "/studio/library", cta: "Open the library" },
      ];
  }
}

export default function StudioHome({ loaderData }: Route.ComponentProps) {
  const { name, organisation, roles, welcome, counts } = loaderData;
  // Someone holding several roles sees every role's next steps once.
  const steps = [...new Map(roles.flatMap((r) => stepsFor(r, counts)).map((s) => [s.title, s])).values()];
  return (
    <div>
      {welcome ? (
        <p role="status" className="mb-6 rounded border-l-4 border-ok bg-green-50 p-3 font-sans text-sm text-ok">
          Welcome to {organisation}. You have joined as {rolesInWords(roles, { lower: true })}.
        </p>
      ) : null}
      <PageHeader title={`Good to see you, ${name.split(" ")[0]}`}>
        <p className="mt-2 text-ink-soft">
          {organisation} · {rolesInWords(roles)} — {roles.map((r) => ROLE_SUMMARIES[r]).join(" ")}
        </p>
      </PageHeader>
      <h2 className="mt-8 text-xl">What you can do next</h2>
      <ul className="mt-4 grid gap-4 md:grid-cols-2">
        {steps.map((s) => (
          <li key={s.title} className="card">
            <h3 className="text-lg">{s.title}</h3>
            <p className="mt-2 text-ink-soft">{s.text}</p>
            {s.to ? <Link to={s.to} className="btn-quiet mt-4 no-underline">{s.cta}</Link> : null}
          </li>
        ))}
      </ul>
    </div>
  );
}
