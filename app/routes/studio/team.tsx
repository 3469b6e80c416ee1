import { data, Form, redirect, useNavigation } from "react-router";
import { z } from "zod";
import { Field, FormMessage } from "~/components/forms";
import { ROLE_LABELS, ROLES } from "~/lib/roles";
import { parseForm } from "~/lib/validation";
import { Membership, User } from "#db/models/index.ts";
import { AccountError, changeRole, inviteMember, InviteSchema, pendingInvitations, removeMember, revokeInvitation } from "#server/accounts.server.ts";
import { requireMember } from "#server/auth.server.ts";
import { noticeHeader } from "#server/session.server.ts";
import type { Route } from "./+types/team";

export const meta: Route.MetaFunction = () => [{ title: "Team · Eonscale" }];

export async function loader({ request }: Route.LoaderArgs) {
  const member = await requireMember(request, ["admin"]);
  const [members, invitations] = await Promise.all([
    Membership.findAll({ where: { organisationId: member.organisation.id }, include: [{ model: User, as: "user" }], order: [["createdAt", "ASC"]] }),
    pendingInvitations(member.organisation.id),
  ]);
  return {
    organisation: member.organisation.name,
    me: member.membership.id,
    members: members.map((m) => ({ id: m.id, name: m.user!.name, email: m.user!.email, role: m.role, since: m.createdAt.toISOString().slice(0, 10), lastSignIn: m.user!.lastSignInAt?.toISOString().slice(0, 10) ?? null })),
    invitations: invitations.map((i) => ({ id: i.id, email: i.email, role: i.role, by: i.invitedBy?.name ?? "—", expires: i.expiresAt.toISOString().slice(0, 10) })),
  };
}

const IdSchema = z.coerce.number({ error: "Missing id." }).int().positive({ error: "Missing id." });
const ActionSchema = z.discriminatedUnion(
  "intent",
  [
    InviteSchema.extend({ intent: z.literal("invite") }),
    z.object({ intent: z.literal("change-role"), membershipId: IdSchema, role: z.enum(ROLES, { error: "Choose a role." }) }),
    z.object({ intent: z.literal("remove"), membershipId: IdSchema }),
    z.object({ intent: z.literal("revoke"), invitationId: IdSchema }),
  ],
  { error: "Unknown action." },
);

export async function action({ request }: Route.ActionArgs) {
  const member = await requireMember(request, ["admin"]);
  const form = await request.formData();
  const parsed = parseForm(ActionSchema, form);
  if (!parsed.ok) return data({ intent: String(form.get("intent")), error: parsed.formError, fields: parsed.fieldErrors }, { status: 400 });
  const input = parsed.data;
  let message: string;
  try {
    if (input.intent === "invite") {
      await inviteMember({ organisation: member.organisation, inviter: member.user, email: input.email, role: input.role });
      message = `Invitation sent to ${input.email} as ${ROLE_LABELS[input.role].toLowerCase()}.`;
    } else if (input.intent === "change-role") {
      await changeRole(member.organisation, member.user, input.membershipId, input.role);
      message = `Role changed to ${ROLE_LABELS[input.role].toLowerCase()}.`;
    } else if (input.intent === "remove") {
      await removeMember(member.organisation, member.user, input.membershipId);
      message = "Member removed.";
    } else {
      await revokeInvitation(member.organisation, member.user, input.invitationId);
      message = "Invitation withdrawn.";
    }
  } catch (error) {
    if (error instanceof AccountError) return data({ intent: input.intent, error: error.message, fields: { [error.field]: error.message } as Record<string, string> }, { status: 400 });
    throw error;
  }
  return redirect("/studio/team", { headers: { "Set-Cookie": await noticeHeader({ kind: "success", message }) } });
}

export default function Team({ loaderData, actionData }: Route.ComponentProps) {
  const { organisation, members, invitations, me } = loaderData;
  const busy = useNavigation().state === "submitting";
  const inviteErrors = actionData?.intent === "invite" ? actionData.fields : {};
  return (
    <div className="grid gap-8 lg:grid-cols-[2fr_1fr]">
      <section>
        <h1 className="text-3xl">Team of {organisation}</h1>
        {actionData && actionData.intent !== "invite" ? <FormMessage>{actionData.error}</FormMessage> : null}
        <div className="card mt-6 overflow-x-auto p-0">
          <table className="w-full text-left text-sm">
            <caption className="sr-only">Members</caption>
            <thead className="border-b border-rule bg-paper">
              <tr>
                <th scope="col" className="p-3">Name</th>
                <th scope="col" className="p-3">E-mail</th>
                <th scope="col" className="p-3">Role</th>
                <th scope="col" className="p-3">Last sign-in</th>
                <th scope="col" className="p-3"><span className="sr-only">Remove</span></th>
              </tr>
            </thead>
            <tbody>
              {members.map((m) => (
                <tr key={m.id} className="border-b border-rule last:border-0">
                  <td className="p-3 font-semibold">{m.name}{m.id === me ? <span className="ml-1 font-normal text-ink-soft">(you)</span> : null}</td>
                  <td className="p-3">{m.email}</td>
                  <td className="p-3">
                    <Form method="post" className="flex items-center gap-2">
                      <input type="hidden" name="intent" value="change-role" />
                      <input type="hidden" name="membershipId" value={m.id} />
                      <label className="sr-only" htmlFor={`role-${m.id}`}>Role of {m.name}</label>
                      <select id={`role-${m.id}`} name="role" defaultValue={m.role} className="field w-auto">
                        {ROLES.map((r) => <option key={r} value={r}>{ROLE_LABELS[r]}</option>)}
                      </select>
                      <button type="submit" className="btn-quiet" disabled={busy}>Save</button>
                    </Form>
                  </td>
                  <td className="p-3 figures">{m.lastSignIn ?? "never"}</td>
                  <td className="p-3">
                    <Form method="post" onSubmit={(e) => { if (!confirm(`Remove ${m.name} from ${organisation}?`)) e.preventDefault(); }}>
                      <input type="hidden" name="intent" value="remove" />
                      <input type="hidden" name="membershipId" value={m.id} />
                      <button type="submit" className="btn-quiet text-danger" disabled={busy}>Remove</button>
                    </Form>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <h2 className="mt-10 text-xl">Pending invitations</h2>
        {invitations.length === 0 ? (
          <p className="mt-2 text-ink-soft">No invitations are waiting. Use the form to invite someone.</p>
        ) : (
          <ul className="mt-3 divide-y divide-rule rounded-lg border border-rule bg-white">
            {invitations.map((i) => (
              <li key={i.id} className="flex flex-wrap items-center justify-between gap-2 p-3 font-sans text-sm">
                <span><strong>{i.email}</strong> as {ROLE_LABELS[i.role].toLowerCase()} · invited by {i.by} · expires {i.expires}</span>
                <Form method="post">
                  <input type="hidden" name="intent" value="revoke" />
                  <input type="hidden" name="invitationId" value={i.id} />
                  <button type="submit" className="btn-quiet">Withdraw</button>
                </Form>
              </li>
            ))}
          </ul>
        )}
      </section>
      <aside>
        <div className="card">
          <h2 className="text-xl">Invite someone</h2>
          <p className="mb-4 mt-1 font-sans text-sm text-ink-soft">They get an e-mail with a link to choose a password and join.</p>
          {actionData?.intent === "invite" && inviteErrors._form ? <FormMessage>{inviteErrors._form}</FormMessage> : null}
          {/* Keyed by the pending list, so the form empties once an invitation has gone out. */}
          <Form method="post" noValidate key={invitations.map((i) => i.id).join(",")}>
            <input type="hidden" name="intent" value="invite" />
            <Field label="E-mail address" name="email" type="email" required error={inviteErrors.email} />
            <div className="mb-4">
              <label htmlFor="invite-role" className="mb-1 block text-sm font-semibold">Role</label>
              <select id="invite-role" name="role" defaultValue="designer" className="field">
                {ROLES.map((r) => <option key={r} value={r}>{ROLE_LABELS[r]}</option>)}
              </select>
              {inviteErrors.role ? <p className="mt-1 font-sans text-sm text-danger">{inviteErrors.role}</p> : null}
            </div>
            <button type="submit" className="btn" disabled={busy}>Send invitation</button>
          </Form>
        </div>
      </aside>
    </div>
  );
}
