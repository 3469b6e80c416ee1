// Account page: changing the password (current one required; other sessions end), sign-out.
import { describe, expect, it } from "vitest";
import * as account from "../../app/routes/studio/account.tsx";
import * as logout from "../../app/routes/logout.tsx";
import { Session } from "../../db/models/index.ts";
import { verifyPassword } from "../../server/auth.server.ts";
import { cookieFor, createMember, createOrganisation, formRequest, routeArgs, settle, TEST_PASSWORD } from "../helpers/db.ts";

describe("account", () => {
  it("changes the password only with the current one, keeps this session and ends the others", async () => {
    const { user } = await createMember(await createOrganisation(), "reviewer");
    const here = await cookieFor(user.id);
    await cookieFor(user.id); // another device
    expect(await Session.count({ where: { userId: user.id } })).toBe(2);

    const wrong = await settle(() => account.action(routeArgs(formRequest("/studio/account", { current: "not-it-at-all", password: "a-new-password", confirm: "a-new-password" }, { cookie: here }))));
    expect(wrong.status).toBe(400);
    expect((wrong.body as { fields: Record<string, string> }).fields.current).toMatch(/not your current password/);
    const short = await settle(() => account.action(routeArgs(formRequest("/studio/account", { current: TEST_PASSWORD, password: "short", confirm: "short" }, { cookie: here }))));
    expect((short.body as { fields: Record<string, string> }).fields.password).toMatch(/at least 10/);
    await user.reload();
    expect(await verifyPassword(TEST_PASSWORD, user.passwordHash)).toBe(true);

    const ok = await settle(() => account.action(routeArgs(formRequest("/studio/account", { current: TEST_PASSWORD, password: "a-new-password", confirm: "a-new-password" }, { cookie: here }))));
    expect(ok.status).toBe(302);
    await user.reload();
    expect(await verifyPassword("a-new-password", user.passwordHash)).toBe(true);
    expect(await Session.count({ where: { userId: user.id } })).toBe(1);
  });

  it("signing out deletes the server-side session and clears the cookie", async () => {
    const { user } = await createMember(await createOrganisation(), "editor");
    const cookie = await cookieFor(user.id);
    const res = await settle(() => logout.action(routeArgs(formRequest("/logout", {}, { cookie }))));
    expect(res.status).toBe(302);
    expect(res.headers.get("Set-Cookie")).toMatch(/en_session=;.*(Max-Age=0|Expires=Thu, 01 Jan 1970)/);
    expect(await Session.count({ where: { userId: user.id } })).toBe(0);
  });
});
