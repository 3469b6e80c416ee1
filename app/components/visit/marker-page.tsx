// The marker page (and the page of a retired sign number). Works with no script at all.
import type { MarkerView, Neighbour, RetiredView } from "../../lib/visit/marker-view";
import { fill } from "../../lib/visit/messages";
import { VisitFrame } from "./frame";
import { Strip } from "./strip";

function NeighbourLink({ n, title, words }: { n: Neighbour; title: string; words: string }) {
  return (
    <p className="m-0">
      <span className="block text-sm text-[#4a5160]">{title}</span>
      <a href={n.href} className="inline-flex min-h-11 items-center font-semibold">
        {n.signNumber}. {n.label}
      </a>
      <span className="block text-[0.95rem]">{words}</span>
    </p>
  );
}

export function MarkerPage({ view }: { view: MarkerView }) {
  const { page } = view;
  const { t } = page;
  const image = view.image;
  const smallest = image ? [...image.sizes].sort((a, b) => a.width - b.width) : [];
  return (
    <VisitFrame page={page} kicker={<a href={view.exhibitHref} className="inline-flex min-h-6 items-center">{view.kicker}</a>} heading={view.label} skipTo="marker-facts" precache={view.precache}>
      <dl id="marker-facts" className="mt-4 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
        <dt className="font-semibold">{t.markerAge}</dt>
        <dd className="m-0 text-lg font-semibold">{view.ageText}</dd>
        {view.within.length ? (
          <>
            <dt className="font-semibold">{t.markerWithin}</dt>
            <dd className="m-0">
              {view.within.map((w, i) => (
                <span key={w.name}>
                  {i ? " › " : ""}
                  <span lang={w.lang ?? undefined}>{w.name}</span>
                </span>
              ))}
            </dd>
          </>
        ) : null}
        <dt className="font-semibold">{t.markerSource}</dt>
        <dd className="m-0">{view.source}</dd>
      </dl>
      <p className="mt-1 text-sm">{t.ageUnitsNote}</p>

      {view.html ? <div className="visit-prose mt-4" dangerouslySetInnerHTML={{ __html: view.html }} /> : null}

      {image && smallest.length ? (
        <figure className="mx-0 mt-4">
          <img
            src={smallest.find((s) => s.width >= 640)?.url ?? smallest.at(-1)!.url}
            srcSet={smallest.map((s) => `${s.url} ${s.width}w`).join(", ")}
            sizes="(min-width: 48rem) 46rem, 100vw"
            alt={image.alt}
            className="h-auto w-full"
          />
          {image.credit ? <figcaption className="text-sm">{fill(t.markerImageCredit, { credit: image.credit })}</figcaption> : null}
        </figure>
      ) : null}

      <section aria-labelledby="position-h">
        <h2 id="position-h" className="mt-6 text-xl font-bold">
          {t.markerPosition}
        </h2>
        <Strip model={view.strip} caption={view.positionText} here={view.signNumber} />
        {view.walk ? (
          <p>
            {t.colWalk}: {view.walk}
          </p>
        ) : null}
        {view.insetLines.map((line) => (
          <p key={line}>{line}</p>
        ))}
      </section>

      <nav aria-label={`${t.markerPrevious} / ${t.markerNext}`} className="mt-6 grid gap-4 sm:grid-cols-2">
        {view.previous ? <NeighbourLink n={view.previous} title={t.markerPrevious} words={view.previous.same ? t.markerSamePlace : fill(t.markerBack, { distance: view.previous.gap })} /> : <p className="m-0">{t.markerFirst}</p>}
        {view.next ? <NeighbourLink n={view.next} title={t.markerNext} words={view.next.same ? t.markerSamePlace : fill(t.markerAhead, { distance: view.next.gap })} /> : <p className="m-0">{t.markerLast}</p>}
      </nav>

      {view.decay ? (
        <section aria-labelledby="decay-h" className="mt-6 rounded border border-[#d5cdbd] bg-white p-4">
          <h2 id="decay-h" className="m-0 text-xl font-bold">
            {t.decayHeading}
          </h2>
          <p>{view.decay.sentence}</p>
          <p className="m-0 text-sm">{fill(t.decayCitation, { citation: view.decay.citation })}</p>
        </section>
      ) : null}

      <p className="mt-6">
        <a href={view.exhibitHref} className="inline-flex min-h-11 items-center">
          {t.markerAll}
        </a>
      </p>
    </VisitFrame>
  );
}

export function RetiredSignPage({ view }: { view: RetiredView }) {
  return (
    <VisitFrame page={view.page} kicker={<a href={view.exhibitHref} className="inline-flex min-h-6 items-center">{view.page.title}</a>} heading={view.heading} skipTo="retired" precache={[]}>
      <p id="retired" className="mt-4">
        {view.text}
      </p>
      {view.absorbedLine ? <p>{view.absorbedLine}</p> : null}
      <p>
        <a href={view.exhibitHref} className="inline-flex min-h-11 items-center">
          {view.page.t.markerAll}
        </a>
      </p>
    </VisitFrame>
  );
}
