// Demo scenario (invented): Marrowby Museum of the Earth and its four-person team.
// Runs only with the demo seeder (npm start, or npm run db:seed -- --demo); never in production data.
import bcrypt from "bcryptjs";
import type { Migration } from "../../migrator.ts";

export const DEMO_PASSWORD = "deep-time-demo";
export const DEMO_ORGANISATION = { name: "Marrowby Museum of the Earth", slug: "marrowby" };
export const DEMO_USERS = [
  { email: "admin@marrowby.example", name: "Ada Quarrie", role: "admin" },
  { email: "designer@marrowby.example", name: "Dev Lindqvist", role: "designer" },
  { email: "reviewer@marrowby.example", name: "Rhona Basalt", role: "reviewer" },
  { email: "editor@marrowby.example", name: "Eli Strand", role: "editor" },
] as const;

export const up: Migration = async ({ sequelize }) => {
  const hash = await bcrypt.hash(DEMO_PASSWORD, 10);
  await sequelize.transaction(async (transaction) => {
    const now = new Date();
    const [[org]] = (await sequelize.query(
      // Marrowby works against ICS 2024/12 (its corridor wall, pinned to 2023/09, needs a re-check).
      `INSERT INTO organisations (name, slug, current_edition_id, created_at, updated_at)
       VALUES ($1, $2, (SELECT id FROM chart_editions WHERE slug = 'ics-2024-12' AND organisation_id IS NULL), $3, $3)
       ON CONFLICT (slug) DO UPDATE SET name = EXCLUDED.name RETURNING id`,
      { bind: [DEMO_ORGANISATION.name, DEMO_ORGANISATION.slug, now], transaction },
    )) as [{ id: number }[], unknown];
    for (const u of DEMO_USERS) {
      const [[user]] = (await sequelize.query(
        `INSERT INTO users (email, name, password_hash, created_at, updated_at) VALUES ($1, $2, $3, $4, $4)
         ON CONFLICT (email) DO UPDATE SET name = EXCLUDED.name RETURNING id`,
        { bind: [u.email, u.name, hash, now], transaction },
      )) as [{ id: number }[], unknown];
      await sequelize.query(
        `INSERT INTO memberships (user_id, organisation_id, roles, created_at, updated_at) VALUES ($1, $2, ARRAY[$3]::enum_memberships_roles[], $4, $4)
         ON CONFLICT (user_id, organisation_id) DO NOTHING`,
        { bind: [user.id, org.id, u.role, now], transaction },
      );
    }
  });
};

export const down: Migration = async ({ sequelize }) => {
  await sequelize.query(`DELETE FROM users WHERE email LIKE '%@marrowby.example'`);
  await sequelize.query(`DELETE FROM organisations WHERE slug = $1`, { bind: [DEMO_ORGANISATION.slug] });
};
