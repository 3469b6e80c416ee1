import { data, Form, Link, redirect, useNavigation } from "react-router";
import { Field, FormMessage } from "~/components/forms";
import { Wordmark } from "~/components/site-header";
import { safeRedirectPath } from "~/lib/redirects";
import { authenticator, getUser, rememberDevice, SignInError, startSession } from "#server/auth.server.ts";
import { RateLimitedError, retryAfter } from "#server/rate-limit.server.ts";
import type { Route } from "./+types/login";

export const meta: Route.MetaFunction = () => [{ title: "Sign in · Eonscale" }];

export async function loader({ request }: Route.LoaderArgs) {
  const url = new URL(request.url);
  const redirectTo = safeRedirectPath(url.searchParams.get("redirectTo"), "/studio");
  if (await getUser(request)) throw redirect(redirectTo);
  return { redirectTo, reset: url.searchParams.get("reset") === "1" };
}

export async function action({ request }: Route.ActionArgs) {
  const form = await request.clone().formData();
  const redirectTo = safeRedirectPath(form.get("redirectTo"), "/studio");
  const email = String(form.get("email") ?? "");
  try {
    const user = await authenticator.authenticate("form", request);
    const headers = new Headers();
    headers.append("Set-Cookie", await startSession(request, user.id));
    headers.append("Set-Cookie", await rememberDevice(request, user.email));
    return redirect(redirectTo, { headers });
  } catch (error) {
    if (error instanceof Response) throw error;
    if (error instanceof RateLimitedError) {
      return data({ error: error.message, fields: {} as Record<string, string>, email }, { status: 429, headers: retryAfter(error) });
    }
    if (error instanceof SignInError) return data({ error: error.message, fields: error.fields, email }, { status: 400 });
    throw error;
  }
}

export default function Login({ loaderData, actionData }: Route.ComponentProps) {
  const busy = useNavigation().state === "submitting";
  return (
    <main className="mx-auto max-w-md px-5 py-12">
      <Wordmark />
      <h1 className="mt-8 text-3xl">Sign in</h1>
      <p className="mt-2 text-ink-soft">For members of an organisation on Eonscale. Visitors don't need an account.</p>
      <div className="card mt-6">
        {loaderData.reset ? <FormMessage kind="success">Your password has been changed. Sign in with the new one.</FormMessage> : null}
        <FormMessage>{actionData?.error}</FormMessage>
        <Form method="post" noValidate>
          <input type="hidden" name="redirectTo" value={loaderData.redirectTo} />
          <Field label="E-mail address" name="email" type="email" autoComplete="email" required defaultValue={actionData?.email} error={actionData?.fields.email} />
          <Field label="Password" name="password" type="password" autoComplete="current-password" required error={actionData?.fields.password} />
          <button type="submit" className="btn w-full justify-center" disabled={busy}>
            {busy ? "Signing in…" : "Sign in"}
          </button>
        </Form>
        <p className="mt-4 font-sans text-sm">
          <Link to="/forgot-password">Forgotten your password?</Link>
        </p>
      </div>
    </main>
  );
}
