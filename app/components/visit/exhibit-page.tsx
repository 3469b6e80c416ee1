// The exhibit page for visitors. Readable with no script at all; public/visit.js adds the
// nearest-marker button and the offline copy (both hidden until the script shows them).
import type { ExhibitView } from "../../lib/visit/exhibit-view";
import { fill } from "../../lib/visit/messages";
import { VisitFrame } from "./frame";
import { MarkerList } from "./marker-list";
import { RouteMap } from "./route-map";
import { Strip } from "./strip";

export function ExhibitPage({ view }: { view: ExhibitView }) {
  const { page } = view;
  const { t } = page;
  return (
    <VisitFrame
      page={page}
      kicker={`${t.exhibitKicker} · ${page.organisationName}`}
      heading={page.title}
      skipTo="markers"
      precache={view.precache}
    >
      <section aria-labelledby="scale-h">
        <h2 id="scale-h" className="mt-6 text-xl font-bold">
          {t.scaleHeading}
        </h2>
        <div className="visit-prose">
          {view.scale.lines.map((line) => (
            <p key={line} className={line === view.scale.lines[0] ? "text-xl font-semibold" : undefined}>
              {line}
            </p>
          ))}
          <p className="text-sm">{t.ageUnitsNote}</p>
        </div>
        {view.scale.durations.length ? (
          <ul className="pl-5">
            {view.scale.durations.map((d) => (
              <li key={d}>{d}</li>
            ))}
          </ul>
        ) : null}
      </section>

      <section aria-labelledby="strip-h">
        <h2 id="strip-h" className="mt-6 text-xl font-bold">
          {t.stripHeading}
        </h2>
        <Strip model={view.strip} caption={view.stripCaption} />
      </section>

      <section aria-labelledby="markers-h" id="markers">
        <h2 id="markers-h" className="mt-6 text-xl font-bold">
          {t.markersHeading}
        </h2>
        {view.walking ? <p className="text-[0.95rem]">{view.walking.total}</p> : null}
        <MarkerList rows={view.rows} t={t} />
        <p className="text-sm">{t.uncertaintyNote}</p>
        {view.walking ? <p className="text-sm">{view.walking.note}</p> : null}
      </section>

      {view.map ? (
        <section aria-labelledby="map-h">
          <h2 id="map-h" className="mt-6 text-xl font-bold">
            {t.mapHeading}
          </h2>
          <RouteMap map={view.map} t={t} />
          {view.nearest ? (
            <div
              id="visit-nearest"
              hidden
              className="mt-3"
              data-nearest={JSON.stringify(view.nearest)}
              data-units={page.units}
              data-t-asking={t.nearestAsking}
              data-t-found={t.nearestFound}
              data-t-off={t.nearestOff}
              data-t-denied={t.nearestDenied}
              data-t-unavailable={t.nearestUnavailable}
              data-t-unsupported={t.nearestUnsupported}
            >
              <button type="button" className="visit-button">
                {t.nearestButton}
              </button>
              <p className="text-sm">{t.nearestHelp}</p>
              <p className="font-semibold" aria-live="polite" data-nearest-out="" />
            </div>
          ) : null}
        </section>
      ) : null}

      {view.cautions.length ? (
        <section aria-labelledby="cautions-h">
          <h2 id="cautions-h" className="mt-6 text-xl font-bold">
            {t.cautionsHeading}
          </h2>
          <ul className="pl-5">
            {view.cautions.map((c) => (
              <li key={c}>{c}</li>
            ))}
          </ul>
        </section>
      ) : null}

      <section aria-labelledby="offline-h" id="visit-keep" hidden>
        <h2 id="offline-h" className="mt-6 text-xl font-bold">
          {t.offlineHeading}
        </h2>
        <p className="text-sm">{fill(t.offlineHelp, { count: view.rows.length })}</p>
        <button type="button" className="visit-button">
          {t.offlineButton}
        </button>
        <p aria-live="polite" data-keep-out="" />
      </section>

      <p className="mt-6 text-sm">{view.editionSource}</p>
      <p className="text-sm">
        <a href={view.jsonHref} className="inline-flex min-h-6 items-center">
          {t.jsonLink}
        </a>
      </p>
    </VisitFrame>
  );
}
