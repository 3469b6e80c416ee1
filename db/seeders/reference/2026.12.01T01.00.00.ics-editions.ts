// Reference data: the ICS 2024/12 (current) and ICS 2023/09 (retired) chart editions, read from the
// generated files in db/data/ics/ (see its README: source, licence CC BY 4.0, corrections).
//
// Idempotent: editions are matched by slug and intervals by (edition, name); running it again
// updates the rows in place (ids stay, so later references to intervals survive). An edition's
// status is only set when it is first inserted, so an editor's later choice of the current
// edition is never undone by a re-seed.
import { readFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import type { Transaction } from "sequelize";
import { check } from "../../../app/lib/timescale/check.ts";
import { inChartOrder } from "../../../app/lib/timescale/order.ts";
import type { Edition } from "../../../app/lib/timescale/types.ts";
import type { Migration, MigrationContext } from "../../migrator.ts";

const here = path.dirname(fileURLToPath(import.meta.url));
export const SEEDED_EDITIONS = ["ics-2024-12", "ics-2023-09"] as const;

export function readSeededEdition(slug: (typeof SEEDED_EDITIONS)[number]): Edition {
  return JSON.parse(readFileSync(path.join(here, "../../data/ics", `${slug}.json`), "utf8")) as Edition;
}

async function seedEdition({ sequelize }: MigrationContext, data: Edition, transaction: Transaction) {
  const problems = check(data.intervals);
  if (problems.length) {
    throw new Error(`${data.edition.slug}: the seed file fails check(): ${problems.slice(0, 3).map((p) => `${p.interval}: ${p.message}`).join("; ")}`);
  }
  const now = new Date();
  const e = data.edition;
  // A second "current" would break the one-current index: then the seeded edition comes in retired.
  const [[{ n: currents }]] = (await sequelize.query(`SELECT count(*)::int AS n FROM chart_editions WHERE status = 'current' AND organisation_id IS NULL AND slug <> $1`, {
    bind: [e.slug],
    transaction,
  })) as [{ n: number }[], unknown];
  const status = e.status === "current" && currents > 0 ? "retired" : e.status;
  const [[edition]] = (await sequelize.query(
    `INSERT INTO chart_editions (slug, label, status, source, licence, source_file, corrections, made_current_at, created_at, updated_at)
     VALUES ($1, $2, $3, $4, $5, $6, $7::jsonb, $8, $9, $9)
     ON CONFLICT (slug) DO UPDATE SET label = EXCLUDED.label, source = EXCLUDED.source, licence = EXCLUDED.licence,
       source_file = EXCLUDED.source_file, corrections = EXCLUDED.corrections, updated_at = EXCLUDED.updated_at
     RETURNING id`,
    { bind: [e.slug, e.label, status, e.source, e.licence, e.sourceFile, JSON.stringify(e.corrections), status === "current" ? now : null, now], transaction },
  )) as [{ id: number }[], unknown];

  // Chart order puts every parent before its children, so parent ids are known when needed.
  const ids = new Map<string, number>();
  for (const iv of inChartOrder(data.intervals)) {
    const parentId = iv.parent === null ? null : ids.get(iv.parent);
    if (parentId === undefined) throw new Error(`${e.slug}: parent "${iv.parent}" of "${iv.name}" comes later in chart order`);
    const [[row]] = (await sequelize.query(
      `INSERT INTO intervals (edition_id, name, rank, parent_id, base_ma, base_uncertainty_ma, top_ma, color, gssp, approximate, names, chart_order, created_at, updated_at, boundary_kind)
       VALUES ($1, $2, $3, $4, $5::numeric, $6::numeric, $7::numeric, $8, $9, $10, $11::jsonb, $12, $13, $13, $14)
       ON CONFLICT (edition_id, name) DO UPDATE SET rank = EXCLUDED.rank, parent_id = EXCLUDED.parent_id, base_ma = EXCLUDED.base_ma,
         base_uncertainty_ma = EXCLUDED.base_uncertainty_ma, top_ma = EXCLUDED.top_ma, color = EXCLUDED.color, gssp = EXCLUDED.gssp, boundary_kind = EXCLUDED.boundary_kind,
         approximate = EXCLUDED.approximate, names = EXCLUDED.names, chart_order = EXCLUDED.chart_order, updated_at = EXCLUDED.updated_at
       RETURNING id`,
      {
        bind: [
          edition.id,
          iv.name,
          iv.rank,
          parentId,
          String(iv.baseMa),
          iv.baseUncertaintyMa === null ? null : String(iv.baseUncertaintyMa),
          String(iv.topMa),
          iv.color,
          iv.gssp,
          iv.approximate,
          JSON.stringify(iv.names),
          iv.order,
          now,
          iv.boundaryKind ?? null,
        ],
        transaction,
      },
    )) as [{ id: number }[], unknown];
    ids.set(iv.name, row.id);
  }
}

export const up: Migration = async (context) => {
  await context.sequelize.transaction(async (transaction) => {
    // A re-seed may reshuffle the (unique) chart order: check it at commit, not row by row.
    await context.sequelize.query(`SET CONSTRAINTS intervals_edition_order DEFERRED`, { transaction });
    for (const slug of SEEDED_EDITIONS) await seedEdition(context, readSeededEdition(slug), transaction);
  });
};

export const down: Migration = async ({ sequelize }) => {
  await sequelize.query(`DELETE FROM chart_editions WHERE slug IN ($1, $2)`, { bind: [...SEEDED_EDITIONS] });
};
