// The local inbox page (/dev/mail): what the SMTP stand-in received, as a plain HTML page. The
// local launcher (fakes/launch.ts) mounts it in front of the app; it is not part of the app's
// route table and never exists in a deployment. It holds reset and invitation links, so it is
// served only to clients on this machine (the connection's own address is a loopback one; no
// forwarded header is believed): anyone else gets 404, as if it did not exist.
import type { RequestHandler } from "express";
import { listMessages } from "./inbox.ts";

const escape = (text: string) => text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
const linkify = (text: string) => escape(text).replace(/https?:\/\/[^\s<]+/g, (url) => `<a href="${url}">${url}</a>`);

/** 127.0.0.0/8, ::1 and IPv4-mapped loopback: the connection comes from this machine. */
export function isLoopback(address: string | undefined): boolean {
  if (!address) return false;
  const v4 = address.startsWith("::ffff:") ? address.slice(7) : address;
  return address === "::1" || /^127\.\d{1,3}\.\d{1,3}\.\d{1,3}$/.test(v4);
}

export function inboxPage(): RequestHandler {
  return async (req, res, next) => {
    if (!isLoopback(req.socket.remoteAddress)) {
      res.status(404).set("Cache-Control", "no-store").type("text/plain").send("Not found");
      return;
    }
    if (req.method !== "GET" || (req.path !== "/" && req.path !== "")) return next();
    let body: string;
    try {
      const messages = (await listMessages()).slice(0, 100);
      body = messages.length
        ? `<ol>${messages
            .map(
              (m) =>
                `<li><p class="meta">${escape(new Date(m.receivedAt).toLocaleString("en-GB"))} · to ${escape(m.to.join(", "))}</p>` +
                `<h2>${escape(m.subject)}</h2><pre>${linkify(m.text)}</pre></li>`,
            )
            .join("")}</ol>`
        : "<p>No messages yet.</p>";
    } catch (error) {
      body = `<p role="alert">The local SMTP stand-in is not reachable (${escape((error as Error).message)}). Start it with npm run services:start.</p>`;
    }
    res.set("Cache-Control", "no-store").type("html").send(`<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>Local inbox · Eonscale</title>
<style>body{font:16px/1.5 system-ui,sans-serif;max-width:56rem;margin:2rem auto;padding:0 1.25rem;color:#222}
ol{list-style:none;padding:0}li{border:1px solid #ccc;border-radius:6px;padding:1rem;margin:1rem 0}
.meta{color:#666;font-size:.875rem;margin:0}h2{font-size:1.125rem;margin:.25rem 0}pre{white-space:pre-wrap;font:inherit;font-size:.875rem}</style>
</head><body><h1>Local inbox</h1>
<p class="meta">E-mail caught by the local SMTP stand-in. Only the local launcher (npm start, npm run dev) serves this page, and only to browsers on this computer (loopback addresses such as 127.0.0.1): from any other machine it does not exist, because these messages hold password-reset and invitation links.</p>
${body}</body></html>`);
  };
}
