import { Link } from "react-router";
import { Wordmark } from "~/components/site-header";
import type { Route } from "./+types/home";

export const meta: Route.MetaFunction = () => [
  { title: "Eonscale — geologic time you can walk" },
  { name: "description", content: "Plan, check and publish time-as-distance exhibits: trails, walls, ropes and banners where every boundary sits at the right place." },
];

const STEPS = [
  { title: "Choose the span and the medium", text: "A riverside trail, a corridor wall, a rope for a school group or a printed banner. Routes are measured on the WGS84 ellipsoid, not guessed from a map." },
  { title: "Place every boundary and event", text: "Boundaries come from a named edition of the International Chronostratigraphic Chart; dated events carry their uncertainty and source. Eonscale tells you what becomes too small to see and proposes magnified insets." },
  { title: "Have a geologist check the numbers", text: "A reviewer who did not edit the exhibit checks each figure against the pinned edition before anything is printed, cut or installed." },
  { title: "Publish for visitors", text: "One page per marker, reached by the QR code on its sign, readable on a phone in sunlight. When a new chart edition moves a boundary, Eonscale lists every exhibit it puts out of date, and by how much." },
];

export default function Home() {
  return (
    <div className="min-h-screen">
      <header className="border-b border-rule bg-paper">
        <div className="mx-auto flex max-w-5xl items-center justify-between px-5 py-4">
          <Wordmark />
          <nav className="flex gap-4 font-sans">
            <Link to="/studio">Studio</Link>
            <Link to="/login">Sign in</Link>
          </nav>
        </div>
      </header>
      <main className="mx-auto max-w-5xl px-5 py-12">
        <section className="max-w-3xl">
          <p className="font-sans text-sm font-semibold uppercase tracking-wide text-sandstone-700">For exhibit designers, interpreters and outreach teams</p>
          <h1 className="mt-3 text-4xl leading-tight md:text-5xl">Turn 4.6 billion years into a distance people can walk — and get every metre right.</h1>
          <p className="mt-5 text-lg text-ink-soft">
            Eonscale plans time-as-distance exhibits: it puts each geologic boundary and dated event at its true place along a trail, wall or rope,
            gives the installation crew coordinates, states each figure's uncertainty and source, and keeps the whole exhibit tied to the chart edition a geologist checked it against.
          </p>
          <div className="mt-8 flex flex-wrap gap-3">
            <Link to="/login" className="btn no-underline">Sign in to the studio</Link>
          </div>
        </section>
        <ol className="mt-14 grid gap-5 md:grid-cols-2">
          {STEPS.map((s, i) => (
            <li key={s.title} className="card">
              <p className="font-sans text-sm text-sandstone-700">Step {i + 1}</p>
              <h2 className="mt-1 text-xl">{s.title}</h2>
              <p className="mt-2 text-ink-soft">{s.text}</p>
            </li>
          ))}
        </ol>
        <aside className="mt-12 rounded-lg border border-rule bg-paper-deep p-5 font-sans text-sm text-ink-soft">
          <p><strong className="text-ink">A scale worth checking.</strong> On a 4.567 km trail at one metre per million years, all of recorded history fits in about five millimetres. Eonscale shows you such places before the signs are made.</p>
        </aside>
      </main>
      <footer className="border-t border-rule py-6 text-center font-sans text-sm text-ink-soft">
        Eonscale · Chart data: International Commission on Stratigraphy, CC BY 4.0
      </footer>
    </div>
  );
}
