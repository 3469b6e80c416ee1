// Every length and range limit of Eonscale in one pure module: the zod schemas (forms and APIs)
// and the Sequelize model definitions (db/models/*) both read it, and
// tests/integration/limits.test.ts compares it with the database's own column types
// (information_schema.columns), so a limit can never differ between the form and the column.

/** Maximum characters of every varchar column, by table and model attribute (camelCase). */
export const TEXT_LIMITS = {
  assets: { originalKey: 300, originalName: 255, alt: 250, credit: 300 },
  audit_events: { action: 100, objectType: 60, objectId: 100 },
  chart_editions: { slug: 60, label: 100, sourceFile: 300 },
  dated_events: { slug: 80, name: 160, doi: 200, url: 500, datingMethod: 200, verification: 60 },
  decay_systems: { slug: 40, parent: 20, daughter: 20, decayMode: 200, doi: 200, verification: 60 },
  exhibit_comments: { markerLabel: 200 },
  exhibit_media: { sourceName: 300 },
  exhibit_reviews: { decision: 20 },
  exhibit_revisions: { action: 80 },
  exhibits: { title: 200, slug: 100, status: 20 },
  image_uses: { alt: 250, credit: 300 },
  insets: { label: 200 },
  intervals: { name: 120, color: 7, boundaryKind: 4 },
  invitations: { email: 254, tokenHash: 64 },
  marker_signs: { label: 200 },
  markers: { label: 200 },
  organisations: { name: 200, slug: 100 },
  outbox_messages: { to: 254, subject: 300 },
  password_resets: { tokenHash: 64 },
  publications: { sha256: 64 },
  sessions: { id: 64 },
  users: { email: 254, name: 200, passwordHash: 100 },
  exhibit_warning_acknowledgements: { warningKey: 5000 },
  // Tables written by raw SQL (no Sequelize model): listed so the schema check covers every column.
  exhibit_route_geometries: { sha256: 64 },
  exhibit_slug_redirects: { oldSlug: 100 },
  organisation_slug_redirects: { oldSlug: 100 },
  export_jobs: { file: 40, fileName: 300, s3Key: 300 },
} as const;

/** PostgreSQL `integer` (int4): every integer a form or API may store (revision, order, ids). */
export const INT4 = { min: -2147483648, max: 2147483647 } as const;

/** Integer columns a client's input reaches, by table and attribute: all are int4. */
export const INTEGER_INPUTS = {
  exhibits: ["revision", "approvedRevision"],
  exhibit_reviews: ["revision"],
  exhibit_comments: ["revision"],
  intervals: ["chartOrder"],
  decay_systems: ["position"],
} as const;

/** Nesting depth accepted in an uploaded GeoJSON document (a FeatureCollection of lines is 5). */
export const MAX_GEOJSON_DEPTH = 32;

/** Largest inset magnification (its generated label must fit insets.label). */
export const MAX_INSET_MAGNIFICATION = 1e12;
