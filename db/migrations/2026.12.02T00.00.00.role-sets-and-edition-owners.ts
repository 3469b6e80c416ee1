// Who may do what, and who owns chart editions:
//  - memberships and invitations hold a SET of roles (a Postgres array of the role enum, never
//    empty, no repeats); today's single role becomes a one-element set;
//  - chart stewards: a site-wide table of the users who manage the shared editions;
//  - chart editions get an owner (organisation_id; NULL = a shared edition, the published ICS
//    editions); at most one "current" (latest) edition per owner instead of one in all;
//  - every organisation chooses its own current edition (organisations.current_edition_id); the
//    existing organisations keep the edition that was current for everyone.
// Down keeps one role per membership (the first of admin, designer, reviewer, editor, so no
// organisation loses its admin) and refuses while organisation-owned editions exist (it would
// otherwise publish them to everyone).
import type { Migration } from "../migrator.ts";

const ROLES = ["admin", "designer", "reviewer", "editor"];
const roleList = ROLES.map((r) => `'${r}'`).join(", ");

async function toRoleSets(table: "memberships" | "invitations", run: (sql: string) => Promise<unknown>) {
  await run(`CREATE TYPE "enum_${table}_roles" AS ENUM (${roleList})`);
  await run(`ALTER TABLE ${table} ADD COLUMN roles "enum_${table}_roles"[]`);
  await run(`UPDATE ${table} SET roles = ARRAY[role::text::"enum_${table}_roles"]`);
  await run(`ALTER TABLE ${table} ALTER COLUMN roles SET NOT NULL`);
  await run(`ALTER TABLE ${table} ADD CONSTRAINT ${table}_roles_not_empty CHECK (cardinality(roles) >= 1)`);
  // No role twice (an array's distinct elements equal its length).
  await run(
    `CREATE FUNCTION ${table}_roles_distinct(r "enum_${table}_roles"[]) RETURNS boolean IMMUTABLE LANGUAGE sql AS $$ SELECT cardinality(r) = (SELECT count(DISTINCT x) FROM unnest(r) x) $$`,
  );
  await run(`ALTER TABLE ${table} ADD CONSTRAINT ${table}_roles_distinct CHECK (${table}_roles_distinct(roles))`);
  await run(`ALTER TABLE ${table} DROP COLUMN role`);
  await run(`DROP TYPE "enum_${table}_role"`);
}

async function toSingleRole(table: "memberships" | "invitations", run: (sql: string) => Promise<unknown>) {
  await run(`CREATE TYPE "enum_${table}_role" AS ENUM (${roleList})`);
  await run(`ALTER TABLE ${table} ADD COLUMN role "enum_${table}_role"`);
  // The first role in the canonical order: an admin stays an admin.
  await run(
    `UPDATE ${table} SET role = (SELECT x::text::"enum_${table}_role" FROM unnest(roles) x ORDER BY array_position(ARRAY[${roleList}]::text[], x::text) LIMIT 1)`,
  );
  await run(`ALTER TABLE ${table} ALTER COLUMN role SET NOT NULL`);
  await run(`ALTER TABLE ${table} DROP COLUMN roles`);
  await run(`DROP FUNCTION ${table}_roles_distinct`);
  await run(`DROP TYPE "enum_${table}_roles"`);
}

export const up: Migration = async ({ sequelize }) => {
  await sequelize.transaction(async (transaction) => {
    const run = (sql: string) => sequelize.query(sql, { transaction });
    await toRoleSets("memberships", run);
    await toRoleSets("invitations", run);

    await run(`CREATE TABLE chart_stewards (
      user_id integer PRIMARY KEY REFERENCES users (id) ON DELETE CASCADE,
      created_at timestamptz NOT NULL DEFAULT now()
    )`);

    await run(`ALTER TABLE chart_editions ADD COLUMN organisation_id integer REFERENCES organisations (id) ON DELETE CASCADE`);
    await run(`CREATE INDEX chart_editions_organisation ON chart_editions (organisation_id)`);
    await run(`DROP INDEX chart_editions_one_current`);
    // One latest ("current") edition per owner: one among the shared editions, one per organisation.
    await run(`CREATE UNIQUE INDEX chart_editions_one_current_per_owner ON chart_editions ((COALESCE(organisation_id, 0))) WHERE status = 'current'`);

    await run(`ALTER TABLE organisations ADD COLUMN current_edition_id integer REFERENCES chart_editions (id) ON DELETE RESTRICT`);
    await run(`UPDATE organisations SET current_edition_id = (SELECT id FROM chart_editions WHERE status = 'current' AND organisation_id IS NULL)`);
  });
};

export const down: Migration = async ({ sequelize }) => {
  await sequelize.transaction(async (transaction) => {
    const run = (sql: string) => sequelize.query(sql, { transaction });
    const [[{ n }]] = (await sequelize.query(`SELECT count(*)::int AS n FROM chart_editions WHERE organisation_id IS NOT NULL`, { transaction })) as [{ n: number }[], unknown];
    if (n > 0) {
      throw new Error(`Rollback refused: ${n} chart edition(s) belong to an organisation; the older schema would show them to everyone. Delete or export them first.`);
    }
    await run(`ALTER TABLE organisations DROP COLUMN current_edition_id`);
    await run(`DROP INDEX chart_editions_one_current_per_owner`);
    await run(`CREATE UNIQUE INDEX chart_editions_one_current ON chart_editions (status) WHERE status = 'current'`);
    await run(`ALTER TABLE chart_editions DROP COLUMN organisation_id`);
    await run(`DROP TABLE chart_stewards`);
    await toSingleRole("invitations", run);
    await toSingleRole("memberships", run);
  });
};
