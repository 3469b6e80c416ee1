// schedule.xlsx: the marker schedule as an Excel workbook (exceljs, streamed): one sheet of
// markers with numbers as numbers, one sheet saying what the file is made from (publication or
// "DRAFT — not checked") and the sources. Text is written as text, formula-looking text prefixed.
import { PassThrough, Readable } from "node:stream";
import ExcelJS from "exceljs";
import type { PublicationSnapshot } from "../../../app/lib/publication/types.ts";
import { DRAFT_NOTICE, statusLine } from "../../../app/lib/exports/common.ts";
import { safeText, SCHEDULE_COLUMNS, scheduleCells } from "../../../app/lib/fabrication/schedule.ts";
import type { FileOptionsContext } from "../pdf/panels.server.ts";

export const XLSX_TYPE = "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet";

/** Write the workbook into `out` (ends it). */
export async function writeScheduleXlsx(out: NodeJS.WritableStream, snapshot: PublicationSnapshot, ctx: FileOptionsContext) {
  const wb = new ExcelJS.stream.xlsx.WorkbookWriter({ stream: out as never, useSharedStrings: false, useStyles: true });
  wb.creator = "Eonscale";
  wb.title = `${snapshot.exhibit.title}: marker schedule`;
  const sheet = wb.addWorksheet("Markers", { views: [{ state: "frozen", ySplit: 1 }] });
  sheet.columns = SCHEDULE_COLUMNS.map((c) => ({ header: c.header, key: c.key, width: c.width }));
  sheet.getRow(1).font = { bold: true };
  sheet.getRow(1).commit();
  for (const cells of scheduleCells(snapshot)) sheet.addRow(cells).commit();
  sheet.commit();
  const about = wb.addWorksheet("About");
  const lines = [
    [safeText(snapshot.exhibit.title)],
    [ctx.draft ? DRAFT_NOTICE : "Published"],
    [safeText(statusLine(snapshot, ctx))],
    [safeText(`${snapshot.scale.statement.lengthPerTime}; ${snapshot.scale.statement.timePerLength}`)],
    [safeText(`Chart: ${snapshot.edition.label} (${snapshot.edition.source}; ${snapshot.edition.licence})`)],
    ["Distances in metres to the millimetre from the older end; coordinates WGS84 to 7 decimals (planning figures, not a survey)."],
    ...Object.entries(snapshot.sources).map(([k, v]) => [safeText(`${k}: ${v}`)]),
    ...snapshot.cautions.map((c) => [safeText(c)]),
  ];
  for (const l of lines) about.addRow(l).commit();
  about.getColumn(1).width = 120;
  about.commit();
  await wb.commit();
}

export function scheduleXlsxResponse(snapshot: PublicationSnapshot, ctx: FileOptionsContext): Response {
  const pass = new PassThrough();
  writeScheduleXlsx(pass, snapshot, ctx).catch((error) => pass.destroy(error as Error));
  return new Response(Readable.toWeb(pass) as unknown as ReadableStream, { headers: { "Content-Type": XLSX_TYPE } });
}
