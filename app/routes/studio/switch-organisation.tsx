import { data, redirect } from "react-router";
import { z } from "zod";
import { parseForm } from "~/lib/validation";
import { rolesInWords } from "~/lib/roles";
import { requireMember } from "#server/auth.server.ts";
import { getSession, noticeHeader, sessionStorage } from "#server/session.server.ts";
import type { Route } from "./+types/switch-organisation";

const Schema = z.object({ organisationId: z.coerce.number({ error: "Choose an organisation." }).int().positive({ error: "Choose an organisation." }) });

export async function loader({ request }: Route.LoaderArgs) {
  await requireMember(request);
  return redirect("/studio");
}

export async function action({ request }: Route.ActionArgs) {
  const member = await requireMember(request);
  const parsed = parseForm(Schema, await request.formData());
  if (!parsed.ok) throw data({ message: parsed.formError }, { status: 400 });
  const target = member.memberships.find((m) => m.organisationId === parsed.data.organisationId);
  // Not a member there: the organisation does not exist as far as this user is concerned.
  if (!target) throw data({ message: "No such organisation among yours." }, { status: 404 });
  const session = await getSession(request);
  session.set("organisationId", target.organisationId);
  const headers = new Headers();
  headers.append("Set-Cookie", await sessionStorage.commitSession(session));
  headers.append("Set-Cookie", await noticeHeader({ kind: "info", message: `You are now working in ${target.organisation!.name} as ${rolesInWords(target.roles, { lower: true })}.` }));
  return redirect("/studio", { headers });
}
