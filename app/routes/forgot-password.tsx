import { data, Form, Link } from "react-router";
import { z } from "zod";
import { Field, FormMessage } from "~/components/forms";
import { Wordmark } from "~/components/site-header";
import { parseForm } from "~/lib/validation";
import { RESET_MINUTES } from "~/lib/account-links";
import { requestPasswordReset } from "#server/accounts.server.ts";
import { clientAddress } from "#server/auth.server.ts";
import { RateLimitedError, retryAfter } from "#server/rate-limit.server.ts";
import type { Route } from "./+types/forgot-password";

export const meta: Route.MetaFunction = () => [{ title: "Reset your password · Eonscale" }];

const Schema = z.object({
  email: z.preprocess((v) => (typeof v === "string" ? v.trim().toLowerCase() : v), z.email({ error: "Enter your e-mail address, like name@example.org." })),
});

export async function action({ request }: Route.ActionArgs) {
  const parsed = parseForm(Schema, await request.formData());
  if (!parsed.ok) return data({ sent: false, error: null, fields: parsed.fieldErrors }, { status: 400 });
  try {
    await requestPasswordReset(parsed.data.email, clientAddress(request));
  } catch (error) {
    if (error instanceof RateLimitedError) return data({ sent: false, error: error.message, fields: {} as Record<string, string> }, { status: 429, headers: retryAfter(error) });
    throw error;
  }
  return { sent: true, error: null, fields: {} as Record<string, string> };
}

export default function ForgotPassword({ actionData }: Route.ComponentProps) {
  return (
    <main className="mx-auto max-w-md px-5 py-12">
      <Wordmark />
      <h1 className="mt-8 text-3xl">Reset your password</h1>
      <div className="card mt-6">
        {actionData?.sent ? (
          <FormMessage kind="success">
            If that address belongs to an Eonscale account, a reset link is on its way. It works once, for {RESET_MINUTES} minutes.
          </FormMessage>
        ) : (
          <Form method="post" noValidate>
            <FormMessage>{actionData?.error}</FormMessage>
            <p className="mb-4 text-ink-soft">Enter the e-mail address you sign in with. We'll send a link to choose a new password.</p>
            <Field label="E-mail address" name="email" type="email" autoComplete="email" required error={actionData?.fields.email} />
            <button type="submit" className="btn">Send the link</button>
          </Form>
        )}
        <p className="mt-4 font-sans text-sm"><Link to="/login">Back to sign in</Link></p>
      </div>
    </main>
  );
}
