// Reference data: decay systems with published half-lives and decay constants
// (db/data/dated-events/decay-systems.ts; sources in its README). Idempotent: matched by slug.
import { SEED_DECAY_SYSTEMS } from "../../data/dated-events/decay-systems.ts";
import type { Migration } from "../../migrator.ts";

/** λ and t½ must agree (λ·t½ = ln 2 to the digits given) — a typo in either fails the seed. */
function assertConsistent() {
  for (const d of SEED_DECAY_SYSTEMS) {
    const product = Number(d.decayConstantPerYear) * Number(d.halfLifeYears);
    if (Math.abs(product / Math.LN2 - 1) > 5e-4) throw new Error(`decay-systems: ${d.slug}: λ·t½ = ${product}, not ln 2`);
    if (d.branchConstantPerYear !== null && Number(d.branchConstantPerYear) > Number(d.decayConstantPerYear)) {
      throw new Error(`decay-systems: ${d.slug}: the branch constant exceeds the total`);
    }
    if (d.citation.trim().length < 20) throw new Error(`decay-systems: ${d.slug}: no full citation`);
  }
}

export const up: Migration = async ({ sequelize }) => {
  assertConsistent();
  await sequelize.transaction(async (transaction) => {
    const now = new Date();
    for (const d of SEED_DECAY_SYSTEMS) {
      await sequelize.query(
        `INSERT INTO decay_systems (slug, parent, daughter, decay_mode, half_life_years, half_life_uncertainty_years, decay_constant_per_year,
           decay_constant_stated, branch_constant_per_year, citation, doi, verification, notes, position, created_at, updated_at)
         VALUES ($1, $2, $3, $4, $5::numeric, $6::numeric, $7::numeric, $8, $9::numeric, $10, $11, $12, $13, $14, $15, $15)
         ON CONFLICT (slug) DO UPDATE SET parent = EXCLUDED.parent, daughter = EXCLUDED.daughter, decay_mode = EXCLUDED.decay_mode,
           half_life_years = EXCLUDED.half_life_years, half_life_uncertainty_years = EXCLUDED.half_life_uncertainty_years,
           decay_constant_per_year = EXCLUDED.decay_constant_per_year, decay_constant_stated = EXCLUDED.decay_constant_stated,
           branch_constant_per_year = EXCLUDED.branch_constant_per_year, citation = EXCLUDED.citation, doi = EXCLUDED.doi,
           verification = EXCLUDED.verification, notes = EXCLUDED.notes, position = EXCLUDED.position, updated_at = EXCLUDED.updated_at`,
        {
          bind: [
            d.slug, d.parent, d.daughter, d.decayMode, d.halfLifeYears, d.halfLifeUncertaintyYears, d.decayConstantPerYear,
            d.decayConstantStated, d.branchConstantPerYear, d.citation, d.doi, d.verification, d.notes, d.position, now,
          ],
          transaction,
        },
      );
    }
  });
};

export const down: Migration = async ({ sequelize }) => {
  await sequelize.query(`DELETE FROM decay_systems WHERE slug = ANY($1)`, { bind: [SEED_DECAY_SYSTEMS.map((d) => d.slug)] });
};
