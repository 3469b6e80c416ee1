// Local SMTP stand-in: accepts every message on 127.0.0.1:<SMTP_PORT> (no TLS, auth optional),
// stores it as JSON under <dataDir>/mail, and serves the stored mail over a small HTTP inbox API
// on 127.0.0.1:<SMTP_INBOX_PORT>:
//   GET    /messages[?to=address]   newest first
//   GET    /messages/:id
//   DELETE /messages                clear the inbox
//   DELETE /messages/:id
// Started in the background by fakes/node-services.ts (`npx tsx fakes/smtp.ts`); tests that need
// their own server (and inbox) call startSmtpStandIn() on other ports.
import { randomBytes } from "node:crypto";
import { mkdirSync, readdirSync, readFileSync, renameSync, rmSync, writeFileSync } from "node:fs";
import type { EventEmitter } from "node:events";
import http from "node:http";
import path from "node:path";
import { simpleParser, type AddressObject } from "mailparser";
import { SMTPServer } from "smtp-server";
import { fileURLToPath } from "node:url";
import { serviceConfig } from "./config.ts";
import type { Message } from "./inbox.ts";
import { onShutdown, writePidFile } from "./process-utils.ts";

export interface SmtpStandInOptions {
  host: string;
  port: number;
  inboxPort: number;
  url: string;
  inboxUrl: string;
  mailDir: string;
}

/** Starts an SMTP server and its HTTP inbox API; resolves once both listen. */
export async function startSmtpStandIn(smtp: SmtpStandInOptions): Promise<{ close(): Promise<void> }> {
  const mailDir = smtp.mailDir;
  mkdirSync(mailDir, { recursive: true });

  // ---------------------------------------------------------------- storage

  let lastStamp = 0;
  /** Millisecond timestamps, strictly increasing within this process so file names sort. */
  function nextStamp(): number {
    const now = Date.now();
    lastStamp = now > lastStamp ? now : lastStamp + 1;
    return lastStamp;
  }

  function addressList(value: AddressObject | AddressObject[] | undefined): string[] {
    const objects = value === undefined ? [] : Array.isArray(value) ? value : [value];
    return objects.flatMap((o) => o.value).map((a) => a.address?.toLowerCase() ?? "").filter(Boolean);
  }

  function addressText(value: AddressObject | AddressObject[] | undefined): string {
    if (value === undefined) return "";
    return (Array.isArray(value) ? value : [value]).map((o) => o.text).join(", ");
  }

  /** `Name <address>` (unquoted) for the first From address, or just the address. */
  function formatFrom(value: AddressObject | undefined): string {
    const first = value?.value[0];
    if (!first?.address) return value?.text ?? "";
    return first.name ? `${first.name} <${first.address}>` : first.address;
  }

  function saveMessage(message: Message): void {
    const file = path.join(mailDir, `${Date.parse(message.receivedAt)}-${message.id}.json`);
    const tmp = path.join(mailDir, `.${message.id}.tmp`);
    writeFileSync(tmp, JSON.stringify(message, null, 2));
    renameSync(tmp, file); // readers never see half-written files
  }

  function messageFiles(): string[] {
    try {
      return readdirSync(mailDir)
        .filter((name) => /^\d+-[0-9a-f]+\.json$/.test(name))
        .sort()
        .reverse(); // newest first: names start with the receive timestamp
    } catch {
      return [];
    }
  }

  function readMessage(name: string): Message | undefined {
    try {
      return JSON.parse(readFileSync(path.join(mailDir, name), "utf8")) as Message;
    } catch {
      return undefined; // removed meanwhile, or not ours
    }
  }

  function recipientsOf(message: Message): string[] {
    return [...message.to, ...(message.headerTo ?? []), ...(message.cc ?? [])].map((a) => a.toLowerCase());
  }

  function listMessages(to?: string): Message[] {
    const wanted = to?.trim().toLowerCase();
    const messages: Message[] = [];
    for (const name of messageFiles()) {
      const message = readMessage(name);
      if (!message) continue;
      if (wanted && !recipientsOf(message).includes(wanted)) continue;
      messages.push(message);
    }
    return messages;
  }

  function fileFor(id: string): string | undefined {
    if (!/^[0-9a-f]+$/.test(id)) return undefined;
    return messageFiles().find((name) => name.endsWith(`-${id}.json`));
  }

  // ---------------------------------------------------------------- SMTP

  const smtpServer = new SMTPServer({
    banner: "Eonscale local SMTP",
    authOptional: true,
    allowInsecureAuth: true,
    disabledCommands: ["STARTTLS"],
    secure: false,
    logger: false,
    size: 25 * 1024 * 1024,
    closeTimeout: 1000,
    onAuth(auth, _session, callback) {
      callback(null, { user: auth.username ?? "local" }); // any credentials are fine locally
    },
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          if (stream.sizeExceeded) {
            const error = Object.assign(new Error("Message exceeds the 25 MB limit"), { responseCode: 552 });
            return callback(error);
          }
          const stamp = nextStamp();
          const envelopeTo = session.envelope.rcptTo.map((a) => a.address.toLowerCase());
          const headerTo = addressList(parsed.to);
          const mailFrom = session.envelope.mailFrom;
          const message: Message = {
            id: randomBytes(6).toString("hex"),
            receivedAt: new Date(stamp).toISOString(),
            from: formatFrom(parsed.from) || (mailFrom ? mailFrom.address : ""),
            fromAddress: parsed.from?.value[0]?.address?.toLowerCase() ?? (mailFrom ? mailFrom.address.toLowerCase() : null),
            to: envelopeTo.length > 0 ? envelopeTo : headerTo,
            subject: parsed.subject ?? "",
            text: parsed.text ?? "",
            html: typeof parsed.html === "string" ? parsed.html : null,
            envelopeFrom: mailFrom ? mailFrom.address : null,
            headerTo,
            toText: addressText(parsed.to),
            cc: addressList(parsed.cc),
            replyTo: parsed.replyTo?.text ?? null,
            messageId: parsed.messageId ?? null,
            headers: Object.fromEntries(
              [...parsed.headerLines].map((h) => [h.key, h.line.slice(h.line.indexOf(":") + 1).trim()]),
            ),
            attachments: parsed.attachments.map((a) => ({
              filename: a.filename ?? null,
              contentType: a.contentType,
              size: a.size,
            })),
          };
          saveMessage(message);
          console.log(`[smtp] ${message.receivedAt} ${message.id} to=${message.to.join(",")} subject=${JSON.stringify(message.subject)}`);
          callback(null, `Stored as ${message.id}`);
        })
        .catch((error: unknown) => {
          console.error("[smtp] could not parse message:", error);
          stream.resume();
          callback(error instanceof Error ? error : new Error(String(error)));
        });
    },
  });

  smtpServer.on("error", (error) => console.error("[smtp] server error:", error));

  // ---------------------------------------------------------------- HTTP inbox API

  function sendJson(res: http.ServerResponse, status: number, body: unknown): void {
    const payload = JSON.stringify(body);
    res.writeHead(status, {
      "content-type": "application/json; charset=utf-8",
      "content-length": Buffer.byteLength(payload),
      "cache-control": "no-store",
    });
    res.end(payload);
  }

  const inbox = http.createServer((req, res) => {
    const url = new URL(req.url ?? "/", smtp.inboxUrl);
    const parts = url.pathname.split("/").filter(Boolean);
    try {
      if (parts.length === 0 && req.method === "GET") {
        return sendJson(res, 200, { ok: true, smtp: smtp.url, messages: messageFiles().length });
      }
      if (parts[0] !== "messages" || parts.length > 2) {
        return sendJson(res, 404, { error: "Not found" });
      }
      const id = parts[1];
      if (req.method === "GET" && id === undefined) {
        return sendJson(res, 200, listMessages(url.searchParams.get("to") ?? undefined));
      }
      if (req.method === "GET" && id !== undefined) {
        const file = fileFor(id);
        const message = file && readMessage(file);
        return message ? sendJson(res, 200, message) : sendJson(res, 404, { error: `No message ${id}` });
      }
      if (req.method === "DELETE" && id === undefined) {
        const files = messageFiles();
        for (const name of files) rmSync(path.join(mailDir, name), { force: true });
        return sendJson(res, 200, { deleted: files.length });
      }
      if (req.method === "DELETE" && id !== undefined) {
        const file = fileFor(id);
        if (!file) return sendJson(res, 404, { error: `No message ${id}` });
        rmSync(path.join(mailDir, file), { force: true });
        return sendJson(res, 200, { deleted: 1 });
      }
      res.setHeader("allow", "GET, DELETE");
      return sendJson(res, 405, { error: "Method not allowed" });
    } catch (error) {
      console.error("[smtp] inbox API error:", error);
      return sendJson(res, 500, { error: String(error) });
    }
  });

  function listen(server: Pick<EventEmitter, "once"> & { listen: (port: number, host: string) => unknown }, port: number) {
    return new Promise<void>((resolve, reject) => {
      server.once("error", reject);
      server.once("listening", () => resolve());
      server.listen(port, smtp.host);
    });
  }

  await listen(smtpServer.server, smtp.port);
  try {
    await listen(inbox, smtp.inboxPort);
  } catch (error) {
    await new Promise<void>((resolve) => smtpServer.close(() => resolve()));
    throw error;
  }
  return {
    async close() {
      inbox.closeAllConnections();
      await Promise.all([
        new Promise<void>((resolve) => inbox.close(() => resolve())),
        new Promise<void>((resolve) => smtpServer.close(() => resolve())),
      ]);
    },
  };
}

if (process.argv[1] !== undefined && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const { smtp } = serviceConfig();
  let standIn: { close(): Promise<void> };
  try {
    standIn = await startSmtpStandIn(smtp);
    writePidFile(smtp.pidFile);
    console.log(`[smtp] SMTP on ${smtp.url}, inbox API on ${smtp.inboxUrl}, mail in ${smtp.mailDir}`);
  } catch (error) {
    console.error("[smtp] failed to start:", error);
    process.exit(1);
  }
  onShutdown(smtp.pidFile, () => standIn.close());
}
