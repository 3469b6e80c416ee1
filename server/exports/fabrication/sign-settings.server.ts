// An exhibit's sign settings: the height of the sign text above the floor or grade and the viewing
// distance the sign sheets size their text for (ADA §703.5.5, the x-height table). No row means the
// defaults (a wall label's centre, 1370 mm [q], read from 1 m). Designers change them; every change
// is audited. Sign sheets may override both per export (`?height=&distance=`).
import { QueryTypes } from "sequelize";
import { parseForm } from "../../../app/lib/validation.ts";
import { SIGN_SETTING_DEFAULTS, signSettingsSchema, type SignSettings } from "../../../app/lib/fabrication/signs.ts";
import { audit } from "../../audit.server.ts";
import type { MemberContext } from "../../auth.server.ts";
import { sequelize } from "../../db.server.ts";
import { EXHIBIT_NOT_FOUND } from "../../exhibits/load.server.ts";

export interface StoredSignSettings extends SignSettings {
  /** False while the exhibit uses the defaults. */
  saved: boolean;
}

export async function signSettingsOf(exhibitId: number): Promise<StoredSignSettings> {
  const [row] = await sequelize.query<{ m: number; d: number }>(`SELECT mounting_height_mm AS m, viewing_distance_mm AS d FROM exhibit_sign_settings WHERE exhibit_id = $1`, { bind: [exhibitId], type: QueryTypes.SELECT });
  return row ? { mountingHeightMm: Number(row.m), viewingDistanceMm: Number(row.d), saved: true } : { ...SIGN_SETTING_DEFAULTS, saved: false };
}

/** The settings of the exhibit of a snapshot (by organisation and exhibit slug). */
export async function signSettingsForSlug(organisationSlug: string, exhibitSlug: string): Promise<StoredSignSettings> {
  const [row] = await sequelize.query<{ id: number }>(`SELECT e.id FROM exhibits e JOIN organisations o ON o.id = e.organisation_id WHERE o.slug = $1 AND e.slug = $2`, { bind: [organisationSlug, exhibitSlug], type: QueryTypes.SELECT });
  return row ? signSettingsOf(row.id) : { ...SIGN_SETTING_DEFAULTS, saved: false };
}

export type SaveResult = { ok: true; settings: SignSettings } | { ok: false; fieldErrors: Record<string, string>; formError: string };

/** Validate and store; 404 for another organisation's exhibit is the caller's (it passes the member's). */
export async function saveSignSettings(member: MemberContext, slug: string, form: FormData): Promise<SaveResult> {
  const parsed = parseForm(signSettingsSchema, form);
  if (!parsed.ok) return { ok: false, fieldErrors: parsed.fieldErrors, formError: parsed.formError };
  const { mountingHeightMm, viewingDistanceMm } = parsed.data;
  await sequelize.transaction(async (transaction) => {
    const [exhibit] = await sequelize.query<{ id: number }>(`SELECT id FROM exhibits WHERE organisation_id = $1 AND slug = $2`, { bind: [member.organisation.id, slug], type: QueryTypes.SELECT, transaction });
    if (!exhibit) throw new Response(EXHIBIT_NOT_FOUND, { status: 404 });
    const before = await signSettingsOf(exhibit.id);
    await sequelize.query(
      `INSERT INTO exhibit_sign_settings (exhibit_id, mounting_height_mm, viewing_distance_mm, updated_by_id, updated_at) VALUES ($1, $2, $3, $4, now())
       ON CONFLICT (exhibit_id) DO UPDATE SET mounting_height_mm = EXCLUDED.mounting_height_mm, viewing_distance_mm = EXCLUDED.viewing_distance_mm, updated_by_id = EXCLUDED.updated_by_id, updated_at = now()`,
      { bind: [exhibit.id, mountingHeightMm, viewingDistanceMm, member.user.id], transaction },
    );
    await audit(
      {
        organisationId: member.organisation.id,
        actorId: member.user.id,
        action: "exhibit.sign-settings",
        objectType: "exhibit",
        objectId: exhibit.id,
        details: { from: { mountingHeightMm: before.mountingHeightMm, viewingDistanceMm: before.viewingDistanceMm }, to: { mountingHeightMm, viewingDistanceMm } },
      },
      transaction,
    );
  });
  return { ok: true, settings: { mountingHeightMm, viewingDistanceMm } };
}

/** What the signs page shows: the exhibit's title, kind, sign settings and whether it has a publication. */
export async function signsPageView(organisationId: number, slug: string) {
  const [row] = await sequelize.query<{ id: number; title: string; kind: string; published: boolean }>(
    `SELECT e.id, e.title, m.kind, EXISTS (SELECT 1 FROM publications p WHERE p.exhibit_id = e.id) AS published
       FROM exhibits e JOIN exhibit_media m ON m.exhibit_id = e.id WHERE e.organisation_id = $1 AND e.slug = $2`,
    { bind: [organisationId, slug], type: QueryTypes.SELECT },
  );
  if (!row) return null;
  return { slug, title: row.title, kind: row.kind as "length" | "route", published: row.published, settings: await signSettingsOf(row.id) };
}
