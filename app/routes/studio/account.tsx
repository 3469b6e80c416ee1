import { data, Form, redirect } from "react-router";
import { Field, FormMessage } from "~/components/forms";
import { PageHeader } from "~/components/page-header";
import { rolesInWords } from "~/lib/roles";
import { parseForm } from "~/lib/validation";
import { AccountError, changePassword, ChangePasswordSchema } from "#server/accounts.server.ts";
import { requireMember } from "#server/auth.server.ts";
import { noticeHeader } from "#server/session.server.ts";
import type { Route } from "./+types/account";

export const meta: Route.MetaFunction = () => [{ title: "Account · Eonscale" }];

export async function loader({ request }: Route.LoaderArgs) {
  const member = await requireMember(request);
  return {
    name: member.user.name,
    email: member.user.email,
    memberships: member.memberships.map((m) => ({ organisation: m.organisation!.name, roles: m.roles })),
  };
}

export async function action({ request }: Route.ActionArgs) {
  const member = await requireMember(request);
  const parsed = parseForm(ChangePasswordSchema, await request.formData());
  if (!parsed.ok) return data({ error: parsed.formError, fields: parsed.fieldErrors }, { status: 400 });
  try {
    await changePassword(member.user, member.sessionId, parsed.data.current, parsed.data.password);
  } catch (error) {
    if (error instanceof AccountError) return data({ error: error.message, fields: { [error.field]: error.message } as Record<string, string> }, { status: 400 });
    throw error;
  }
  return redirect("/studio/account", {
    headers: { "Set-Cookie": await noticeHeader({ kind: "success", message: "Password changed. Other devices have been signed out." }) },
  });
}

export default function Account({ loaderData, actionData }: Route.ComponentProps) {
  return (
    <div className="grid gap-8 md:grid-cols-2">
      <section>
        <PageHeader title="Your account" />
        <dl className="card mt-6 grid grid-cols-[auto_1fr] gap-x-6 gap-y-2 font-sans text-sm">
          <dt className="font-semibold">Name</dt><dd>{loaderData.name}</dd>
          <dt className="font-semibold">E-mail</dt><dd>{loaderData.email}</dd>
          <dt className="font-semibold">Organisations</dt>
          <dd>
            <ul>{loaderData.memberships.map((m) => <li key={m.organisation}>{m.organisation} — {rolesInWords(m.roles)}</li>)}</ul>
          </dd>
        </dl>
      </section>
      <section className="card">
        <h2 className="text-xl">Change your password</h2>
        <FormMessage>{actionData?.error}</FormMessage>
        <Form method="post" noValidate className="mt-4">
          <Field label="Current password" name="current" type="password" autoComplete="current-password" required error={actionData?.fields.current} />
          <Field label="New password" name="password" type="password" autoComplete="new-password" hint="At least 10 characters." required error={actionData?.fields.password} />
          <Field label="Repeat the new password" name="confirm" type="password" autoComplete="new-password" required error={actionData?.fields.confirm} />
          <button type="submit" className="btn">Change password</button>
        </Form>
      </section>
    </div>
  );
}
