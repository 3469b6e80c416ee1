// The library events an exhibit's event markers point at (shared entries and the organisation's own).
import { Op } from "sequelize";
import { DatedEvent } from "../db/models/index.ts";

export interface LibraryEvent {
  id: number;
  name: string;
  ageMa: number;
  uncertaintyMa: number | null;
  citation: string;
}

export async function eventsByIds(ids: number[], organisationId: number): Promise<Map<number, LibraryEvent>> {
  if (ids.length === 0) return new Map();
  const rows = await DatedEvent.findAll({ where: { id: ids, [Op.or]: [{ organisationId: null }, { organisationId }] } });
  return new Map(
    rows.map((r) => [r.id, { id: r.id, name: r.name, ageMa: Number(r.ageMa), uncertaintyMa: r.uncertaintyMa == null ? null : Number(r.uncertaintyMa), citation: r.citation }]),
  );
}
