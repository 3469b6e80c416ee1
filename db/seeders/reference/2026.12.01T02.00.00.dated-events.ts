// Reference data: the shared dated-event library (db/data/dated-events/dated-events.ts; sources and
// verification levels in its README). Shared entries have organisation_id NULL.
//
// Idempotent: entries are matched by slug among the shared entries and updated in place, so ids
// (which exhibit markers point at) survive a re-seed.
import { SEED_DATED_EVENTS } from "../../data/dated-events/dated-events.ts";
import { DatedEventFormSchema, fromMa } from "../../../app/lib/dated-events.ts";
import type { Migration } from "../../migrator.ts";

/** Every seeded entry passes the same validation as the studio form (a typo fails the seed). */
function assertValid() {
  const slugs = new Set<string>();
  for (const e of SEED_DATED_EVENTS) {
    if (slugs.has(e.slug)) throw new Error(`dated-events: slug ${e.slug} appears twice`);
    slugs.add(e.slug);
    const parsed = DatedEventFormSchema.safeParse({
      ...e,
      ageValue: e.ageMa,
      ageUnit: "Ma",
      uncertaintyValue: e.uncertaintyMa ?? "",
      doi: e.doi ?? "",
      url: e.url ?? "",
      datingMethod: e.datingMethod ?? "",
    });
    if (!parsed.success) throw new Error(`dated-events: ${e.slug}: ${parsed.error.issues.map((i) => i.message).join("; ")}`);
    if (fromMa(parsed.data.ageMa, "Ma") !== e.ageMa) throw new Error(`dated-events: ${e.slug}: age ${e.ageMa} does not round-trip`);
  }
}

export const up: Migration = async ({ sequelize }) => {
  assertValid();
  await sequelize.transaction(async (transaction) => {
    const now = new Date();
    for (const e of SEED_DATED_EVENTS) {
      await sequelize.query(
        `INSERT INTO dated_events (organisation_id, slug, name, summary, age_ma, uncertainty_ma, age_kind, citation, doi, url, dating_method, verification, created_at, updated_at)
         VALUES (NULL, $1, $2, $3, $4::numeric, $5::numeric, $6, $7, $8, $9, $10, $11, $12, $12)
         ON CONFLICT (slug) WHERE organisation_id IS NULL DO UPDATE SET name = EXCLUDED.name, summary = EXCLUDED.summary,
           age_ma = EXCLUDED.age_ma, uncertainty_ma = EXCLUDED.uncertainty_ma, age_kind = EXCLUDED.age_kind,
           citation = EXCLUDED.citation, doi = EXCLUDED.doi, url = EXCLUDED.url, dating_method = EXCLUDED.dating_method,
           verification = EXCLUDED.verification, updated_at = EXCLUDED.updated_at`,
        {
          bind: [e.slug, e.name, e.summary, e.ageMa, e.uncertaintyMa, e.ageKind, e.citation, e.doi, e.url, e.datingMethod, e.verification, now],
          transaction,
        },
      );
    }
  });
};

export const down: Migration = async ({ sequelize }) => {
  await sequelize.query(`DELETE FROM dated_events WHERE organisation_id IS NULL AND slug = ANY($1)`, { bind: [SEED_DATED_EVENTS.map((e) => e.slug)] });
};
