import { redirect } from "react-router";
import { getSession, sessionStorage } from "#server/session.server.ts";
import type { Route } from "./+types/logout";

export async function loader() {
  // Signing out changes state, so it only happens by POST.
  return redirect("/studio");
}

export async function action({ request }: Route.ActionArgs) {
  const session = await getSession(request);
  return redirect("/", { headers: { "Set-Cookie": await sessionStorage.destroySession(session) } });
}
