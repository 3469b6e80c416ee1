// The words of the trade the studio and the edition pages use, each with a short plain explanation.
// The glossary page lists them all; the Term component shows one on hover or focus where it is
// first used on a page. Plain data: no React.

export interface GlossaryEntry {
  /** Anchor on the glossary page, e.g. "gssp". */
  id: string;
  /** The word as the trade writes it. */
  term: string;
  /** The plain words we put beside it on screen. */
  plain: string;
  /** One or two sentences for someone new to geology or exhibit making. */
  explanation: string;
}

export const GLOSSARY: readonly GlossaryEntry[] = [
  { id: "ma", term: "Ma", plain: "million years ago", explanation: "Ages on the chart are counted back from the present. 66 Ma means 66 million years ago. The same letters after a length of time (e.g. “lasted 2 Ma”) mean “million years”." },
  { id: "ka", term: "ka", plain: "thousand years ago", explanation: "11.7 ka means 11,700 years ago. Used for the recent past, such as the end of the last ice age." },
  { id: "ga", term: "Ga", plain: "billion years ago", explanation: "4.567 Ga means 4,567 million years ago, the age of the oldest solid material in the Solar System." },
  { id: "a", term: "a", plain: "years ago", explanation: "A plain count of years before the present; 150 a is 150 years ago." },
  { id: "chart-edition", term: "chart edition", plain: "a dated version of the geologic timescale", explanation: "The International Commission on Stratigraphy publishes the International Chronostratigraphic Chart and revises it every year or two. Each exhibit is checked against one named edition, such as “ICS 2024/12”." },
  { id: "pinned", term: "checked against (pinned to)", plain: "the chart edition this exhibit's ages come from", explanation: "An exhibit keeps the chart edition it was made with, so its numbers do not change under the designer's feet. When a newer edition becomes current, the exhibit is flagged for a re-check." },
  { id: "re-pin", term: "move to the current edition (re-pin)", plain: "take the ages from the newer chart edition", explanation: "Markers on interval boundaries move to the ages of the newer edition. The exhibit gets a new revision and goes through review again." },
  { id: "needs-recheck", term: "needs re-check", plain: "a newer chart edition is in use", explanation: "Your organisation now works with a newer chart edition than the one this exhibit was checked against. The impact report shows which markers would move and by how much." },
  { id: "revision", term: "revision", plain: "saved version number", explanation: "Every saved change makes a new numbered version. If two people edit at once, the second save is refused rather than silently overwriting the first." },
  { id: "slug", term: "web address (slug)", plain: "the last part of the page's address", explanation: "Made from the title: “Riverside walk” becomes riverside-walk, so the exhibit lives at …/exhibits/riverside-walk." },
  { id: "interval", term: "interval", plain: "a named stretch of geologic time", explanation: "An eon, era, period, epoch or age on the chart, e.g. the Jurassic period. Each has a base (its older end) and a top (its younger end)." },
  { id: "rank", term: "rank", plain: "the level on the chart", explanation: "From the longest to the shortest: eon, era, period, sub-period, epoch, age. Each level divides the one above it." },
  { id: "boundary", term: "boundary marker", plain: "the start of an interval", explanation: "A marker placed at the base (older end) of an interval of the chart; its age comes from the pinned chart edition." },
  { id: "event", term: "dated event", plain: "something that happened, with its age and source", explanation: "Not a chart boundary: e.g. “oldest known mineral grains”. The event library keeps each with its age, ± and citation." },
  { id: "custom", term: "age of your own", plain: "an age you add, with its source", explanation: "For anything not in the library, such as the year a boathouse was built. The reviewer checks the source." },
  { id: "gssp", term: "GSSP", plain: "the reference point in rock that defines this boundary", explanation: "Global Boundary Stratotype Section and Point: a marked level in one rock section somewhere in the world, chosen by international agreement as the start of an interval." },
  { id: "gssa", term: "GSSA", plain: "a boundary defined by a chosen number of years", explanation: "Global Standard Stratigraphic Age: for the oldest intervals, where no rock section can serve, the boundary is simply set at an agreed age." },
  { id: "uncertainty", term: "±", plain: "give or take", explanation: "How far the true age may lie from the stated one. On the exhibit it becomes a length: 66.0 ± 0.05 Ma at 1 m per million years is ± 5 cm." },
  { id: "inset", term: "inset", plain: "a magnified close-up of part of the exhibit", explanation: "A short stretch of time shown at a larger scale (e.g. the last 10,000 years at 1,000×), so markers that would crowd together become readable. It carries its own scale statement." },
  { id: "magnification", term: "magnification", plain: "how many times larger the inset is drawn", explanation: "At 100× one metre of the main exhibit becomes 100 m of inset." },
  { id: "visible-length", term: "smallest visible length", plain: "the shortest stretch a visitor can see", explanation: "Anything shorter is reported as too small to see. The default depends on the medium: 5 cm on a trail, 3 mm on a wall." },
  { id: "spacing", term: "smallest marker spacing", plain: "how close two markers may stand", explanation: "Closer markers are reported as crowded. The default depends on the medium: 2 m on a trail, 4 cm on a wall." },
  { id: "wgs84", term: "WGS84 ellipsoid", plain: "the shape of the Earth GPS uses", explanation: "Route lengths are measured on this standard model of the Earth, the same one GPS receivers use, so they match what a phone or surveyor measures." },
  { id: "geojson-gpx", term: "GeoJSON, GPX", plain: "route files from mapping apps and GPS devices", explanation: "Two common file formats for a path on the ground. Export one from a GPS device, a walking app or a mapping program." },
  { id: "decay-system", term: "decay system", plain: "the radioactive clock used to date a rock", explanation: "A parent isotope that turns into a daughter at a known rate (its half-life), e.g. uranium-238 to lead-206. Named on a marker, it adds a “how we know” sentence." },
  { id: "half-life", term: "half-life", plain: "the time for half of a radioactive parent to decay", explanation: "After one half-life half the parent atoms are left, after two a quarter, and so on." },
  { id: "schedule", term: "marker schedule", plain: "the list the installation crew works from", explanation: "A spreadsheet (CSV) of every marker with its number, label, age and distance (and, on routes, coordinates)." },
];

const BY_ID = new Map(GLOSSARY.map((g) => [g.id, g]));

export type GlossaryId = (typeof GLOSSARY)[number]["id"];

/** One entry by its id; throws on an unknown id so a typo fails in tests, not silently on screen. */
export function glossaryEntry(id: string): GlossaryEntry {
  const entry = BY_ID.get(id);
  if (!entry) throw new Error(`No glossary entry "${id}"`);
  return entry;
}
