import { data, Form, Link, redirect } from "react-router";
import { Field, FormMessage } from "~/components/forms";
import { Wordmark } from "~/components/site-header";
import { parseForm } from "~/lib/validation";
import { AccountError, checkResetToken, resetPassword, ResetSchema } from "#server/accounts.server.ts";
import type { Route } from "./+types/reset-password";

export const meta: Route.MetaFunction = () => [{ title: "Choose a new password · Eonscale" }];

export async function loader({ params }: Route.LoaderArgs) {
  const state = await checkResetToken(params.token);
  return state.ok ? { valid: true as const, message: null } : { valid: false as const, message: state.message };
}

export async function action({ request, params }: Route.ActionArgs) {
  const parsed = parseForm(ResetSchema, await request.formData());
  if (!parsed.ok) return data({ error: parsed.formError, fields: parsed.fieldErrors }, { status: 400 });
  try {
    await resetPassword(params.token, parsed.data.password);
  } catch (error) {
    if (error instanceof AccountError) return data({ error: error.message, fields: {} as Record<string, string> }, { status: 400 });
    throw error;
  }
  return redirect("/login?reset=1");
}

export default function ResetPassword({ loaderData, actionData }: Route.ComponentProps) {
  return (
    <main className="mx-auto max-w-md px-5 py-12">
      <Wordmark />
      <h1 className="mt-8 text-3xl">Choose a new password</h1>
      <div className="card mt-6">
        {!loaderData.valid ? (
          <>
            <FormMessage>{loaderData.message}</FormMessage>
            <Link to="/forgot-password">Ask for a new link</Link>
          </>
        ) : (
          <Form method="post" noValidate>
            <FormMessage>{actionData?.error}</FormMessage>
            <Field label="New password" name="password" type="password" autoComplete="new-password" hint="At least 10 characters." required error={actionData?.fields.password} />
            <Field label="Repeat the new password" name="confirm" type="password" autoComplete="new-password" required error={actionData?.fields.confirm} />
            <button type="submit" className="btn">Set the password</button>
          </Form>
        )}
      </div>
    </main>
  );
}
