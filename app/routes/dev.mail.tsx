// Development inbox: what the local SMTP stand-in (fakes/smtp.ts) received. Absent in production.
import { data } from "react-router";
import { listMessages } from "#fakes/inbox.ts";
import type { Route } from "./+types/dev.mail";

export const meta: Route.MetaFunction = () => [{ title: "Local inbox · Eonscale" }];

export async function loader() {
  if (process.env.NODE_ENV === "production" && process.env.EONSCALE_LOCAL !== "1") throw data({ message: "Not found" }, { status: 404 });
  try {
    const messages = await listMessages();
    return { messages: messages.slice(0, 100).map((m) => ({ id: m.id, to: m.to.join(", "), subject: m.subject, receivedAt: m.receivedAt, text: m.text })), error: null };
  } catch (error) {
    return { messages: [], error: `The local SMTP stand-in is not reachable (${(error as Error).message}). Start it with npm run services:start.` };
  }
}

export default function DevMail({ loaderData }: Route.ComponentProps) {
  return (
    <main className="mx-auto max-w-4xl px-5 py-8">
      <h1 className="text-3xl">Local inbox</h1>
      <p className="mt-2 font-sans text-sm text-ink-soft">E-mail caught by the development SMTP server. This page does not exist in production.</p>
      {loaderData.error ? <p role="alert" className="mt-4 text-danger">{loaderData.error}</p> : null}
      {loaderData.messages.length === 0 && !loaderData.error ? <p className="mt-6">No messages yet.</p> : null}
      <ol className="mt-6 space-y-4">
        {loaderData.messages.map((m) => (
          <li key={m.id} className="card">
            <p className="font-sans text-sm text-ink-soft">{new Date(m.receivedAt).toLocaleString("en-GB")} · to {m.to}</p>
            <h2 className="mt-1 text-lg">{m.subject}</h2>
            <pre className="mt-3 whitespace-pre-wrap font-sans text-sm">{linkify(m.text)}</pre>
          </li>
        ))}
      </ol>
    </main>
  );
}

function linkify(text: string) {
  return text.split(/(https?:\/\/\S+)/g).map((part, i) => (/^https?:\/\//.test(part) ? <a key={i} href={part}>{part}</a> : part));
}
