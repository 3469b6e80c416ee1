// Client for the local SMTP stand-in's inbox API (fakes/smtp.ts). Used by tests and by the
// local launcher's /dev/mail page (fakes/inbox-page.ts). Reads INBOX_URL (or SMTP_INBOX_PORT).
import { serviceConfig } from "./config.ts";

export interface Message {
  id: string;
  /** ISO timestamp at which the SMTP stand-in accepted the message. */
  receivedAt: string;
  /** The From header as written, e.g. `Eonscale <no-reply@eonscale.test>`. */
  from: string;
  /** The From address alone, lower-cased. */
  fromAddress?: string | null;
  /** Envelope recipients (RCPT TO), lower-cased; includes Bcc recipients. */
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  envelopeFrom?: string | null;
  /** Addresses from the To header, lower-cased. */
  headerTo?: string[];
  /** The To header as written. */
  toText?: string;
  cc?: string[];
  replyTo?: string | null;
  messageId?: string | null;
  headers?: Record<string, string>;
  attachments?: { filename: string | null; contentType: string; size: number }[];
}

export function inboxUrl(env: Record<string, string | undefined> = process.env): string {
  return (env.INBOX_URL || serviceConfig(env).INBOX_URL).replace(/\/+$/, "");
}

async function request(path: string, init?: RequestInit): Promise<Response> {
  const url = `${inboxUrl()}${path}`;
  try {
    return await fetch(url, { ...init, signal: init?.signal ?? AbortSignal.timeout(5000) });
  } catch (error) {
    throw new Error(
      `The local mail inbox at ${url} is not reachable (is it running? npm run services:start): ${String(error)}`,
      { cause: error },
    );
  }
}

/** Stored messages, newest first; `to` keeps only mail addressed to that address. */
export async function listMessages(opts: { to?: string } = {}): Promise<Message[]> {
  const query = opts.to ? `?to=${encodeURIComponent(opts.to)}` : "";
  const res = await request(`/messages${query}`);
  if (!res.ok) throw new Error(`GET /messages failed: ${res.status} ${await res.text()}`);
  return (await res.json()) as Message[];
}

export async function getMessage(id: string): Promise<Message | null> {
  const res = await request(`/messages/${encodeURIComponent(id)}`);
  if (res.status === 404) return null;
  if (!res.ok) throw new Error(`GET /messages/${id} failed: ${res.status} ${await res.text()}`);
  return (await res.json()) as Message;
}

/** Deletes every stored message; returns how many were removed. */
export async function clearInbox(): Promise<number> {
  const res = await request("/messages", { method: "DELETE" });
  if (!res.ok) throw new Error(`DELETE /messages failed: ${res.status} ${await res.text()}`);
  return ((await res.json()) as { deleted: number }).deleted;
}

export interface WaitForMessageOptions {
  to: string;
  subjectIncludes?: string;
  /** Only consider messages received at or after this moment. */
  since?: Date | string | number;
  timeoutMs?: number;
  intervalMs?: number;
}

/** Polls the inbox until a matching message arrives (newest match wins) or the timeout passes. */
export async function waitForMessage(opts: WaitForMessageOptions): Promise<Message> {
  const { to, subjectIncludes, timeoutMs = 10_000, intervalMs = 100 } = opts;
  const since = opts.since === undefined ? undefined : new Date(opts.since).getTime();
  const deadline = Date.now() + timeoutMs;
  let seen: Message[] = [];
  let lastError: unknown;
  for (;;) {
    try {
      seen = await listMessages({ to });
      lastError = undefined;
      const match = seen.find(
        (m) =>
          (subjectIncludes === undefined || m.subject.includes(subjectIncludes)) &&
          (since === undefined || Date.parse(m.receivedAt) >= since),
      );
      if (match) return match;
    } catch (error) {
      lastError = error; // the inbox may be restarting; keep polling until the deadline
    }
    if (Date.now() >= deadline) break;
    await new Promise((resolve) => setTimeout(resolve, intervalMs));
  }
  const wanted = subjectIncludes === undefined ? "" : ` with a subject containing ${JSON.stringify(subjectIncludes)}`;
  const found = seen.length
    ? ` Mail for ${to}: ${seen.map((m) => JSON.stringify(m.subject)).join(", ")}.`
    : ` No mail for ${to} at all.`;
  throw new Error(
    `No message to ${to}${wanted} within ${timeoutMs} ms.${found}${lastError ? ` Last error: ${String(lastError)}` : ""}`,
  );
}

/** Deletes one stored message; resolves false when it did not exist. */
export async function deleteMessage(id: string): Promise<boolean> {
  const res = await request(`/messages/${encodeURIComponent(id)}`, { method: "DELETE" });
  if (res.status === 404) return false;
  if (!res.ok) throw new Error(`DELETE /messages/${id} failed: ${res.status} ${await res.text()}`);
  return true;
}
