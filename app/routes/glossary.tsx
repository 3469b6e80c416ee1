// /glossary — the trade's words the studio and the chart pages use, in plain words.
import { PageHeader } from "~/components/page-header";
import { GLOSSARY } from "~/lib/glossary";
import type { Route } from "./+types/glossary";

export const meta: Route.MetaFunction = () => [{ title: "Glossary · Eonscale" }];

export default function Glossary() {
  return (
    <div className="max-w-3xl">
      <PageHeader title="Glossary" lead="The words of geology and exhibit making that Eonscale uses, in plain words. Underlined with dots on other pages, they explain themselves when you point at them, tab to them or tap them." />
      <dl className="mt-6 divide-y divide-rule rounded-lg border border-rule bg-white">
        {GLOSSARY.map((g) => (
          <div key={g.id} id={g.id} className="scroll-mt-4 p-4">
            <dt className="font-sans font-semibold">{g.term} <span className="font-normal text-ink-soft">— {g.plain}</span></dt>
            <dd className="mt-1 text-sm">{g.explanation}</dd>
          </div>
        ))}
      </dl>
    </div>
  );
}
