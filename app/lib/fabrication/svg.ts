// A page of shapes (draw.ts) as a standalone SVG document, sized in millimetres (1 user unit = 1 mm).
// Text is escaped; fonts are named (IBM Plex Sans, Literata) with generic fallbacks. Pure.
import type { Page, Shape } from "./draw";

const FONT: Record<string, string> = {
  sans: `font-family="IBM Plex Sans, Helvetica, Arial, sans-serif"`,
  "sans-bold": `font-family="IBM Plex Sans, Helvetica, Arial, sans-serif" font-weight="600"`,
  serif: `font-family="Literata, Georgia, serif"`,
};

export function escapeXml(s: string): string {
  return s.replace(/[<>&"']/g, (c) => ({ "<": "&lt;", ">": "&gt;", "&": "&amp;", '"': "&quot;", "'": "&apos;" })[c]!);
}

const n = (x: number) => Number(x.toFixed(4)).toString();

function shapeSvg(s: Shape, clipId: () => string): string {
  switch (s.kind) {
    case "rect": {
      const fill = s.hatch ? "url(#hatch)" : (s.fill ?? "none");
      const stroke = s.stroke ? ` stroke="${s.stroke}" stroke-width="${n(s.strokeMm ?? 0.2)}"` : "";
      return `<rect x="${n(s.x)}" y="${n(s.y)}" width="${n(s.w)}" height="${n(s.h)}" fill="${fill}"${stroke}/>`;
    }
    case "line": {
      const dash = s.dashMm ? ` stroke-dasharray="${n(s.dashMm[0])} ${n(s.dashMm[1])}"` : "";
      return `<line x1="${n(s.x1)}" y1="${n(s.y1)}" x2="${n(s.x2)}" y2="${n(s.y2)}" stroke="${s.stroke}" stroke-width="${n(s.strokeMm)}"${dash}${s.role ? ` class="${s.role}"` : ""}/>`;
    }
    case "text": {
      const anchor = s.anchor === "start" ? "" : ` text-anchor="${s.anchor}"`;
      const rotate = s.rotate ? ` transform="rotate(${n(s.rotate)} ${n(s.x)} ${n(s.y)})"` : "";
      const opacity = s.opacity !== undefined ? ` fill-opacity="${n(s.opacity)}"` : "";
      return `<text x="${n(s.x)}" y="${n(s.y)}" font-size="${n(s.sizeMm)}" ${FONT[s.font]} fill="${s.fill}"${anchor}${rotate}${opacity}>${escapeXml(s.text)}</text>`;
    }
    case "image":
      return `<rect x="${n(s.x)}" y="${n(s.y)}" width="${n(s.w)}" height="${n(s.h)}" fill="#dddddd"/>`;
    case "clip-start": {
      const id = clipId();
      return `<clipPath id="${id}"><rect x="${n(s.x)}" y="${n(s.y)}" width="${n(s.w)}" height="${n(s.h)}"/></clipPath><g clip-path="url(#${id})">`;
    }
    case "clip-end":
      return `</g>`;
  }
}

/** The page as an SVG document; `title` becomes its <title>. */
export function pageSvg(page: Page, title: string): string {
  let clips = 0;
  const body = page.shapes.map((s) => shapeSvg(s, () => `clip${++clips}`)).join("\n");
  return [
    `<?xml version="1.0" encoding="UTF-8"?>`,
    `<svg xmlns="http://www.w3.org/2000/svg" width="${n(page.widthMm)}mm" height="${n(page.heightMm)}mm" viewBox="0 0 ${n(page.widthMm)} ${n(page.heightMm)}">`,
    `<title>${escapeXml(title)}</title>`,
    `<defs><pattern id="hatch" width="4" height="4" patternUnits="userSpaceOnUse" patternTransform="rotate(45)"><line x1="0" y1="0" x2="0" y2="4" stroke="#bbbbbb" stroke-width="0.5"/></pattern></defs>`,
    `<rect width="100%" height="100%" fill="#ffffff"/>`,
    body,
    `</svg>`,
    ``,
  ].join("\n");
}
