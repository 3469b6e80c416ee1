// Review and publication: the exhibit lifecycle (status, the approved revision), every revision's
// content (a JSONB copy per revision, route geometries kept once by hash), reviews (decisions with
// the check results), comments (threaded, per exhibit or per marker, resolvable), publications
// (immutable: a trigger refuses UPDATE and DELETE), sign numbers (never reused) and slug redirects
// (organisation and exhibit slugs are frozen once published: a rename keeps the old one).
import { DataTypes } from "sequelize";
import type { Migration } from "../migrator.ts";

const created = { created_at: { type: DataTypes.DATE, allowNull: false } };
const user = (allowNull = true) => ({ type: DataTypes.INTEGER, allowNull, references: { model: "users", key: "id" }, onDelete: "SET NULL" as const });
const exhibit = (onDelete: "CASCADE" | "RESTRICT" = "CASCADE") => ({ type: DataTypes.INTEGER, allowNull: false, references: { model: "exhibits", key: "id" }, onDelete });

export const EXHIBIT_STATUSES = ["draft", "in_review", "changes_requested", "approved", "published"] as const;

export const up: Migration = async ({ queryInterface: q, sequelize }) => {
  await sequelize.transaction(async (transaction) => {
    const run = (sql: string) => sequelize.query(sql, { transaction });
    // The one-value enum becomes a checked text column (adding enum values cannot be used in the same transaction).
    await run(`ALTER TABLE exhibits ALTER COLUMN status DROP DEFAULT`);
    await run(`ALTER TABLE exhibits ALTER COLUMN status TYPE varchar(20) USING status::text`);
    await run(`ALTER TABLE exhibits ALTER COLUMN status SET DEFAULT 'draft'`);
    await run(`DROP TYPE IF EXISTS "enum_exhibits_status"`);
    await run(`ALTER TABLE exhibits ADD CONSTRAINT exhibits_status CHECK (status IN (${EXHIBIT_STATUSES.map((s) => `'${s}'`).join(", ")}))`);
    await q.addColumn("exhibits", "approved_revision", { type: DataTypes.INTEGER, allowNull: true }, { transaction });
    await q.addColumn("exhibits", "approved_by_id", user(), { transaction });
    await q.addColumn("exhibits", "approved_at", { type: DataTypes.DATE, allowNull: true }, { transaction });
    await q.addColumn("exhibits", "status_changed_at", { type: DataTypes.DATE, allowNull: true }, { transaction });

    await q.createTable("exhibit_route_geometries", {
      sha256: { type: DataTypes.STRING(64), primaryKey: true },
      geometry: { type: DataTypes.JSONB, allowNull: false },
      ...created,
    }, { transaction });
    await q.createTable("exhibit_revisions", {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      exhibit_id: exhibit(),
      revision: { type: DataTypes.INTEGER, allowNull: false },
      author_id: user(),
      action: { type: DataTypes.STRING(80), allowNull: false },
      content: { type: DataTypes.JSONB, allowNull: false },
      ...created,
    }, { transaction });
    await q.addIndex("exhibit_revisions", ["exhibit_id", "revision"], { unique: true, transaction });

    await q.createTable("exhibit_reviews", {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      exhibit_id: exhibit(),
      revision: { type: DataTypes.INTEGER, allowNull: false },
      reviewer_id: user(),
      decision: { type: DataTypes.STRING(20), allowNull: false },
      comment: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
      checks: { type: DataTypes.JSONB, allowNull: false },
      ...created,
    }, { transaction });
    await run(`ALTER TABLE exhibit_reviews ADD CONSTRAINT exhibit_reviews_decision CHECK (decision IN ('approved', 'changes_requested'))`);
    await q.addIndex("exhibit_reviews", ["exhibit_id"], { transaction });

    await q.createTable("exhibit_comments", {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      exhibit_id: exhibit(),
      // A marker may be removed later: the comment keeps its id and label (no foreign key).
      marker_id: { type: DataTypes.INTEGER, allowNull: true },
      marker_label: { type: DataTypes.STRING(200), allowNull: true },
      parent_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: "exhibit_comments", key: "id" }, onDelete: "CASCADE" },
      author_id: user(),
      body: { type: DataTypes.TEXT, allowNull: false },
      revision: { type: DataTypes.INTEGER, allowNull: false },
      resolved_at: { type: DataTypes.DATE, allowNull: true },
      resolved_by_id: user(),
      ...created,
    }, { transaction });
    await q.addIndex("exhibit_comments", ["exhibit_id"], { transaction });

    await q.createTable("publications", {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      exhibit_id: exhibit("RESTRICT"),
      number: { type: DataTypes.INTEGER, allowNull: false },
      revision: { type: DataTypes.INTEGER, allowNull: false },
      edition_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "chart_editions", key: "id" }, onDelete: "RESTRICT" },
      approved_by_id: user(),
      published_by_id: user(),
      approved_at: { type: DataTypes.DATE, allowNull: false },
      published_at: { type: DataTypes.DATE, allowNull: false },
      // What the public JSON says about the publication, fixed at publication (names as they were then).
      meta: { type: DataTypes.JSONB, allowNull: false },
      snapshot: { type: DataTypes.JSONB, allowNull: false },
      // The RFC 8785 canonical JSON of the snapshot, and its SHA-256 (hex).
      snapshot_canonical: { type: DataTypes.TEXT, allowNull: false },
      sha256: { type: DataTypes.STRING(64), allowNull: false },
    }, { transaction });
    await q.addIndex("publications", ["exhibit_id", "number"], { unique: true, transaction });
    await run(`CREATE FUNCTION publications_immutable() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        RAISE EXCEPTION 'publications are immutable: % refused on publication %', TG_OP, OLD.id USING ERRCODE = 'integrity_constraint_violation';
      END $$`);
    await run(`CREATE TRIGGER publications_no_update BEFORE UPDATE OR DELETE ON publications FOR EACH ROW EXECUTE FUNCTION publications_immutable()`);
    await run(`CREATE TRIGGER publications_no_truncate BEFORE TRUNCATE ON publications FOR EACH STATEMENT EXECUTE FUNCTION publications_immutable()`);

    await q.createTable("marker_signs", {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      exhibit_id: exhibit("RESTRICT"),
      number: { type: DataTypes.INTEGER, allowNull: false },
      // The marker the sign stands for (no foreign key: the marker may be removed; the number stays taken).
      marker_id: { type: DataTypes.INTEGER, allowNull: false },
      label: { type: DataTypes.STRING(200), allowNull: false },
      first_publication: { type: DataTypes.INTEGER, allowNull: false },
      retired_at_publication: { type: DataTypes.INTEGER, allowNull: true },
      absorbed_by_number: { type: DataTypes.INTEGER, allowNull: true },
      ...created,
    }, { transaction });
    await q.addIndex("marker_signs", ["exhibit_id", "number"], { unique: true, transaction });
    await q.addIndex("marker_signs", ["exhibit_id", "marker_id"], { unique: true, transaction });
    await run(`CREATE FUNCTION marker_signs_keep_number() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        IF TG_OP = 'DELETE' OR NEW.number <> OLD.number OR NEW.marker_id <> OLD.marker_id THEN
          RAISE EXCEPTION 'sign numbers are never changed, removed or reused (sign % of exhibit %)', OLD.number, OLD.exhibit_id USING ERRCODE = 'integrity_constraint_violation';
        END IF;
        RETURN NEW;
      END $$`);
    await run(`CREATE TRIGGER marker_signs_keep BEFORE UPDATE OR DELETE ON marker_signs FOR EACH ROW EXECUTE FUNCTION marker_signs_keep_number()`);

    // Slugs frozen once published: renaming a published exhibit (or an organisation with one) keeps the old slug as a redirect.
    await q.createTable("exhibit_slug_redirects", {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organisation_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "organisations", key: "id" }, onDelete: "CASCADE" },
      old_slug: { type: DataTypes.STRING(100), allowNull: false },
      exhibit_id: exhibit(),
      ...created,
    }, { transaction });
    await q.addIndex("exhibit_slug_redirects", ["organisation_id", "old_slug"], { unique: true, transaction });
    await q.createTable("organisation_slug_redirects", {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      old_slug: { type: DataTypes.STRING(100), allowNull: false, unique: true },
      organisation_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "organisations", key: "id" }, onDelete: "CASCADE" },
      ...created,
    }, { transaction });
    await run(`CREATE FUNCTION exhibits_keep_published_slug() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        IF NEW.slug <> OLD.slug AND EXISTS (SELECT 1 FROM publications WHERE exhibit_id = OLD.id) THEN
          INSERT INTO exhibit_slug_redirects (organisation_id, old_slug, exhibit_id, created_at)
          VALUES (OLD.organisation_id, OLD.slug, OLD.id, now())
          ON CONFLICT (organisation_id, old_slug) DO UPDATE SET exhibit_id = EXCLUDED.exhibit_id;
        END IF;
        RETURN NEW;
      END $$`);
    await run(`CREATE TRIGGER exhibits_slug_redirect BEFORE UPDATE OF slug ON exhibits FOR EACH ROW EXECUTE FUNCTION exhibits_keep_published_slug()`);
    await run(`CREATE FUNCTION organisations_keep_published_slug() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        IF NEW.slug <> OLD.slug AND EXISTS (SELECT 1 FROM publications p JOIN exhibits e ON e.id = p.exhibit_id WHERE e.organisation_id = OLD.id) THEN
          INSERT INTO organisation_slug_redirects (old_slug, organisation_id, created_at) VALUES (OLD.slug, OLD.id, now())
          ON CONFLICT (old_slug) DO UPDATE SET organisation_id = EXCLUDED.organisation_id;
        END IF;
        RETURN NEW;
      END $$`);
    await run(`CREATE TRIGGER organisations_slug_redirect BEFORE UPDATE OF slug ON organisations FOR EACH ROW EXECUTE FUNCTION organisations_keep_published_slug()`);
  });
};

export const down: Migration = async ({ queryInterface: q, sequelize }) => {
  await sequelize.transaction(async (transaction) => {
    const run = (sql: string) => sequelize.query(sql, { transaction });
    await run(`DROP TRIGGER IF EXISTS organisations_slug_redirect ON organisations`);
    await run(`DROP TRIGGER IF EXISTS exhibits_slug_redirect ON exhibits`);
    for (const table of ["organisation_slug_redirects", "exhibit_slug_redirects", "marker_signs", "publications", "exhibit_comments", "exhibit_reviews", "exhibit_revisions", "exhibit_route_geometries"]) {
      await q.dropTable(table, { transaction });
    }
    for (const fn of ["organisations_keep_published_slug", "exhibits_keep_published_slug", "marker_signs_keep_number", "publications_immutable"]) await run(`DROP FUNCTION IF EXISTS ${fn}()`);
    for (const column of ["status_changed_at", "approved_at", "approved_by_id", "approved_revision"]) await q.removeColumn("exhibits", column, { transaction });
    await run(`ALTER TABLE exhibits DROP CONSTRAINT exhibits_status`);
    await run(`UPDATE exhibits SET status = 'draft'`);
    await run(`CREATE TYPE "enum_exhibits_status" AS ENUM ('draft')`);
    await run(`ALTER TABLE exhibits ALTER COLUMN status DROP DEFAULT`);
    await run(`ALTER TABLE exhibits ALTER COLUMN status TYPE "enum_exhibits_status" USING status::"enum_exhibits_status"`);
    await run(`ALTER TABLE exhibits ALTER COLUMN status SET DEFAULT 'draft'`);
  });
};
