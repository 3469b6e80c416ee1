// What a visitor sees at an address with no publication (unknown, or a draft): plain words, no studio links.
import { messagesFor } from "../../lib/visit/messages";

export function VisitNotFound() {
  const t = messagesFor("en");
  return (
    <main className="mx-auto max-w-3xl px-4 py-10">
      <h1 className="text-3xl font-bold">{t.notFoundHeading}</h1>
      <p>{t.notFoundText}</p>
    </main>
  );
}
