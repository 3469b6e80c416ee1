// /studio/team — admins manage the organisation's members: the set of roles each holds (checkboxes;
// at least one role each, and at least one admin in the organisation, kept under concurrent
// changes), removals, and invitations carrying one or more roles.
import { data, Form, redirect, useNavigation } from "react-router";
import { z } from "zod";
import { Field, FormMessage } from "~/components/forms";
import { ROLE_LABELS, ROLE_SUMMARIES, ROLES, rolesInWords, type Role } from "~/lib/roles";
import { parseForm } from "~/lib/validation";
import { AccountError, inviteMember, InviteSchema, listMembers, pendingInvitations, removeMember, revokeInvitation, RoleSetSchema, setRoles } from "#server/accounts.server.ts";
import { requirePermission } from "#server/auth.server.ts";
import { noticeHeader } from "#server/session.server.ts";
import type { Route } from "./+types/team";

export const meta: Route.MetaFunction = () => [{ title: "Team · Eonscale" }];

export async function loader({ request }: Route.LoaderArgs) {
  const member = await requirePermission(request, "members.manage");
  const [members, invitations] = await Promise.all([listMembers(member.organisation.id), pendingInvitations(member.organisation.id)]);
  return {
    organisation: member.organisation.name,
    me: member.membership.id,
    members,
    invitations: invitations.map((i) => ({ id: i.id, email: i.email, roles: i.roles, by: i.invitedBy?.name ?? "—", expires: i.expiresAt.toISOString().slice(0, 10) })),
  };
}

const IdSchema = z.coerce.number({ error: "Missing id." }).int().positive({ error: "Missing id." }).max(2147483647, { error: "Missing id." });
const ActionSchema = z.discriminatedUnion(
  "intent",
  [
    InviteSchema.extend({ intent: z.literal("invite") }),
    z.object({ intent: z.literal("set-roles"), membershipId: IdSchema, roles: RoleSetSchema }),
    z.object({ intent: z.literal("remove"), membershipId: IdSchema }),
    z.object({ intent: z.literal("revoke"), invitationId: IdSchema }),
  ],
  { error: "Unknown action." },
);

export async function action({ request }: Route.ActionArgs) {
  const member = await requirePermission(request, "members.manage");
  const form = await request.formData();
  // Checkboxes send one `roles` field per ticked box.
  const parsed = parseForm(ActionSchema, { ...Object.fromEntries(form), roles: form.getAll("roles") });
  const intent = String(form.get("intent"));
  const target = String(form.get("membershipId") ?? "");
  if (!parsed.ok) return data({ intent, target, error: parsed.formError, fields: parsed.fieldErrors }, { status: 400 });
  const input = parsed.data;
  let message: string;
  try {
    if (input.intent === "invite") {
      await inviteMember({ organisation: member.organisation, inviter: member.user, email: input.email, roles: input.roles });
      message = `Invitation sent to ${input.email} as ${rolesInWords(input.roles, { lower: true })}.`;
    } else if (input.intent === "set-roles") {
      await setRoles(member.organisation, member.user, input.membershipId, input.roles);
      message = `Roles saved: ${rolesInWords(input.roles, { lower: true })}.`;
    } else if (input.intent === "remove") {
      await removeMember(member.organisation, member.user, input.membershipId);
      message = "Member removed.";
    } else {
      await revokeInvitation(member.organisation, member.user, input.invitationId);
      message = "Invitation withdrawn.";
    }
  } catch (error) {
    if (error instanceof AccountError) return data({ intent, target, error: error.message, fields: { [error.field]: error.message } as Record<string, string> }, { status: 400 });
    throw error;
  }
  return redirect("/studio/team", { headers: { "Set-Cookie": await noticeHeader({ kind: "success", message }) } });
}

function RoleBoxes({ idPrefix, checked, error }: { idPrefix: string; checked: readonly Role[]; error?: string }) {
  return (
    <fieldset aria-describedby={error ? `${idPrefix}-error` : undefined}>
      <legend className="sr-only">Roles</legend>
      <div className="flex flex-wrap gap-x-3 gap-y-1">
        {ROLES.map((r) => (
          <label key={r} className="flex items-center gap-1 font-sans text-sm" title={ROLE_SUMMARIES[r]}>
            <input type="checkbox" name="roles" value={r} defaultChecked={checked.includes(r)} /> {ROLE_LABELS[r]}
          </label>
        ))}
      </div>
      {error ? <p id={`${idPrefix}-error`} className="mt-1 font-sans text-sm text-danger">{error}</p> : null}
    </fieldset>
  );
}

export default function Team({ loaderData, actionData }: Route.ComponentProps) {
  const { organisation, members, invitations, me } = loaderData;
  const busy = useNavigation().state === "submitting";
  const inviteErrors = actionData?.intent === "invite" ? actionData.fields : {};
  const rowError = (id: number) => (actionData?.intent === "set-roles" && actionData.target === String(id) ? (actionData.fields.roles ?? actionData.error) : undefined);
  return (
    <div className="grid gap-8 lg:grid-cols-[2fr_1fr]">
      <section className="min-w-0">
        <h1 className="text-3xl">Team of {organisation}</h1>
        <p className="mt-2 text-ink-soft">A member may hold several roles: a small museum's curator can design and review (never approving an exhibit they edited). Every organisation keeps at least one admin.</p>
        {actionData && actionData.intent !== "invite" && actionData.intent !== "set-roles" ? <FormMessage>{actionData.error}</FormMessage> : null}
        <div className="card mt-6 p-0">
          <table className="table-cards w-full text-left text-sm">
            <caption className="sr-only">Members</caption>
            <thead className="border-b border-rule bg-paper">
              <tr>
                <th scope="col" className="p-3">Name</th>
                <th scope="col" className="p-3">Roles</th>
                <th scope="col" className="p-3">Last sign-in</th>
                <th scope="col" className="p-3"><span className="sr-only">Remove</span></th>
              </tr>
            </thead>
            <tbody>
              {members.map((m) => (
                <tr key={m.id} className="border-b border-rule align-top last:border-0">
                  <td className="p-3" data-label="Name"><span className="font-semibold">{m.name}</span>{m.id === me ? <span className="ml-1 text-ink-soft">(you)</span> : null}<span className="block text-xs text-ink-soft">{m.email}</span></td>
                  <td className="p-3" data-label="Roles">
                    <Form method="post" className="flex flex-wrap items-start gap-2" aria-label={`Roles of ${m.name}`}>
                      <input type="hidden" name="intent" value="set-roles" />
                      <input type="hidden" name="membershipId" value={m.id} />
                      <RoleBoxes idPrefix={`roles-${m.id}`} checked={m.roles} error={rowError(m.id)} />
                      <button type="submit" className="btn-quiet" disabled={busy}>Save</button>
                    </Form>
                  </td>
                  <td className="p-3 figures" data-label="Last sign-in">{m.lastSignIn ?? "never"}</td>
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
                <span className="min-w-0"><strong>{i.email}</strong> as {rolesInWords(i.roles, { lower: true })} · invited by {i.by} · expires {i.expires}</span>
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
      <aside className="min-w-0">
        <div className="card">
          <h2 className="text-xl">Invite someone</h2>
          <p className="mb-4 mt-1 font-sans text-sm text-ink-soft">They get an e-mail with a link to choose a password and join.</p>
          {actionData?.intent === "invite" && inviteErrors._form ? <FormMessage>{inviteErrors._form}</FormMessage> : null}
          {/* Keyed by the pending list, so the form empties once an invitation has gone out. */}
          <Form method="post" noValidate key={invitations.map((i) => i.id).join(",")}>
            <input type="hidden" name="intent" value="invite" />
            <Field label="E-mail address" name="email" type="email" required error={inviteErrors.email} />
            <div className="mb-4">
              <p className="mb-1 block text-sm font-semibold">Roles</p>
              <RoleBoxes idPrefix="invite-roles" checked={["designer"]} error={inviteErrors.roles} />
            </div>
            <button type="submit" className="btn" disabled={busy}>Send invitation</button>
          </Form>
        </div>
      </aside>
    </div>
  );
}
