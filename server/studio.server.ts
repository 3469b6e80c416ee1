// Figures for the studio home page: the organisation's members, open invitations and exhibits.
import { Op } from "sequelize";
import { Invitation, Membership } from "../db/models/index.ts";
import { exhibitCounts } from "./exhibits/list.server.ts";

export interface StudioCounts {
  members: number;
  /** Invitations neither accepted, revoked nor expired. */
  pending: number;
  exhibits: number;
  /** Exhibits pinned to a chart edition that is no longer current. */
  recheck: number;
}

export async function studioCounts(organisationId: number): Promise<StudioCounts> {
  const [members, pending, exhibits] = await Promise.all([
    Membership.count({ where: { organisationId } }),
    Invitation.count({ where: { organisationId, acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: new Date() } } }),
    exhibitCounts(organisationId),
  ]);
  return { members, pending, ...exhibits };
}
