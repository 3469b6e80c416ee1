import { data, Form, Link, redirect } from "react-router";
import { Field, FormMessage } from "~/components/forms";
import { Wordmark } from "~/components/site-header";
import { ROLE_SUMMARIES, rolesInWords } from "~/lib/roles";
import { AccountError, acceptInvitation, checkInvitation } from "#server/accounts.server.ts";
import { startSession } from "#server/auth.server.ts";
import { RateLimitedError, retryAfter } from "#server/rate-limit.server.ts";
import type { Route } from "./+types/invite";

export const meta: Route.MetaFunction = () => [{ title: "Accept an invitation · Eonscale" }];

export async function loader({ params }: Route.LoaderArgs) {
  const state = await checkInvitation(params.token);
  if (!state.ok) return { valid: false as const, message: state.message };
  return {
    valid: true as const,
    email: state.invitation.email,
    roles: state.invitation.roles,
    organisation: state.organisation.name,
    hasAccount: Boolean(state.existingUser),
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const form = Object.fromEntries(await request.formData());
  try {
    const { user, organisation } = await acceptInvitation(params.token, form, request);
    const cookie = await startSession(request, user.id, organisation.id);
    return redirect("/studio?welcome=1", { headers: { "Set-Cookie": cookie } });
  } catch (error) {
    if (error instanceof AccountError) return data({ error: error.message, field: error.field }, { status: 400 });
    if (error instanceof RateLimitedError) return data({ error: error.message, field: "_form" }, { status: 429, headers: retryAfter(error) });
    throw error;
  }
}

export default function Invite({ loaderData, actionData }: Route.ComponentProps) {
  const fieldError = (name: string) => (actionData?.field === name ? actionData.error : undefined);
  return (
    <main className="mx-auto max-w-md px-5 py-12">
      <Wordmark />
      {!loaderData.valid ? (
        <div className="card mt-8">
          <h1 className="text-2xl">This invitation can't be used</h1>
          <FormMessage>{loaderData.message}</FormMessage>
          <Link to="/login">Go to sign in</Link>
        </div>
      ) : (
        <>
          <h1 className="mt-8 text-3xl">Join {loaderData.organisation}</h1>
          <p className="mt-2 text-ink-soft">
            You are invited as <strong>{rolesInWords(loaderData.roles, { lower: true })}</strong>: {loaderData.roles.map((r) => ROLE_SUMMARIES[r]).join(" ")}
          </p>
          <div className="card mt-6">
            {actionData?.field === "_form" ? <FormMessage>{actionData.error}</FormMessage> : null}
            <Form method="post" noValidate>
              <p className="mb-4 font-sans text-sm">E-mail address: <strong>{loaderData.email}</strong></p>
              {loaderData.hasAccount ? (
                <Field label="Your Eonscale password" name="password" type="password" autoComplete="current-password" hint="You already have an account: confirm it's you." required error={fieldError("password")} />
              ) : (
                <>
                  <Field label="Your name" name="name" autoComplete="name" required error={fieldError("name")} />
                  <Field label="Choose a password" name="password" type="password" autoComplete="new-password" hint="At least 10 characters." required error={fieldError("password")} />
                  <Field label="Repeat the password" name="confirm" type="password" autoComplete="new-password" required error={fieldError("confirm")} />
                </>
              )}
              <button type="submit" className="btn">Accept and join</button>
            </Form>
          </div>
        </>
      )}
    </main>
  );
}
