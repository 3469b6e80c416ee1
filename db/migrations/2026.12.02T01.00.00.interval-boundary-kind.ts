// Boundary kinds: a ratified base is defined either by a GSSP (a point in a rock section) or by a
// GSSA (a numerical age — the Precambrian boundaries). intervals.gssp keeps meaning "ratified,
// either way"; boundary_kind says which (NULL = not ratified, or the kind not stated). Existing
// rows get NULL; the reference seeder fills the seeded ICS editions.
import type { Migration } from "../migrator.ts";

export const up: Migration = async ({ sequelize }) => {
  await sequelize.transaction(async (transaction) => {
    for (const sql of [
      `ALTER TABLE intervals ADD COLUMN boundary_kind VARCHAR(4) NULL`,
      `ALTER TABLE intervals ADD CONSTRAINT intervals_boundary_kind CHECK (boundary_kind IS NULL OR (boundary_kind IN ('GSSP', 'GSSA') AND gssp IS TRUE))`,
    ]) {
      await sequelize.query(sql, { transaction });
    }
  });
};

export const down: Migration = async ({ sequelize }) => {
  await sequelize.query(`ALTER TABLE intervals DROP COLUMN boundary_kind`);
};
