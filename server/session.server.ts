// Server-side sessions: React Router's createSessionStorage with rows in the sessions table;
// the cookie holds only a signed random id. A separate short cookie carries one-time notices.
import { randomBytes } from "node:crypto";
import { createCookie, createCookieSessionStorage, createSessionStorage } from "react-router";
import { Op, type Transaction } from "sequelize";
import { Session } from "../db/models/index.ts";
import { env } from "./env.server.ts";

const SESSION_DAYS = 14;

const secure = env().NODE_ENV === "production" && env().APP_URL.startsWith("https:");
const secrets = env().SESSION_SECRET.split(",").map((s) => s.trim()).filter(Boolean);

export const sessionCookie = createCookie("en_session", {
  httpOnly: true,
  sameSite: "lax",
  secure,
  path: "/",
  secrets,
  maxAge: SESSION_DAYS * 24 * 3600,
});

/**
 * The device cookie (OWASP "Slow Down Online Guessing Attacks with Device Cookies"): after a
 * right password this browser is trusted for that address, so other clients' failures at the
 * address never slow it down (server/rate-limit.server.ts). Signed, holds no address in clear.
 */
export const deviceCookie = createCookie("en_device", {
  httpOnly: true,
  sameSite: "lax",
  secure,
  path: "/",
  secrets,
  maxAge: 365 * 24 * 3600,
});

export interface SessionData {
  userId: number;
  organisationId: number;
}

export const sessionStorage = createSessionStorage<SessionData>({
  cookie: sessionCookie,
  async createData(data, expires) {
    const id = randomBytes(24).toString("base64url");
    await Session.create({
      id,
      userId: (data.userId as number | undefined) ?? null,
      data: data as Record<string, unknown>,
      expiresAt: expires ?? new Date(Date.now() + SESSION_DAYS * 86400_000),
    });
    return id;
  },
  async readData(id) {
    const row = await Session.findOne({ where: { id, expiresAt: { [Op.gt]: new Date() } } });
    return row ? (row.data as Partial<SessionData>) : null;
  },
  async updateData(id, data, expires) {
    await Session.update(
      {
        data: data as Record<string, unknown>,
        userId: (data.userId as number | undefined) ?? null,
        expiresAt: expires ?? new Date(Date.now() + SESSION_DAYS * 86400_000),
      },
      { where: { id } },
    );
  },
  async deleteData(id) {
    await Session.destroy({ where: { id } });
  },
});

export function getSession(request: Request) {
  return sessionStorage.getSession(request.headers.get("Cookie"));
}

/** Ends every session of a user (after a password change or reset), optionally keeping one. */
export async function endUserSessions(userId: number, keepSessionId?: string, transaction?: Transaction) {
  await Session.destroy({ where: { userId, ...(keepSessionId ? { id: { [Op.ne]: keepSessionId } } : {}) }, transaction });
}

// One-time notices ("Invitation sent") shown after a redirect.
export interface Notice {
  kind: "success" | "info" | "error";
  message: string;
}

const noticeStorage = createCookieSessionStorage<Record<string, never>, { notice: Notice }>({
  cookie: { name: "en_notice", httpOnly: true, sameSite: "lax", secure, path: "/", secrets, maxAge: 60 },
});

export async function noticeHeader(notice: Notice): Promise<string> {
  const s = await noticeStorage.getSession();
  s.flash("notice", notice);
  return noticeStorage.commitSession(s);
}

export async function readNotice(request: Request): Promise<{ notice: Notice | null; setCookie: string | null }> {
  const s = await noticeStorage.getSession(request.headers.get("Cookie"));
  const notice = s.get("notice") ?? null;
  return { notice, setCookie: notice ? await noticeStorage.commitSession(s) : null };
}
