// Where the numbers of markers go on a drawn strip so that none overlap: each label sits in the
// first of a few rows above (or below) the strip where it fits, with a leader line down to its
// marker that crosses no other label; a crowd that fits in no row becomes one group label
// ("12–18") over a bracket, which the page lets the reader expand into a list. Pure: no React.

export interface LabelItem {
  id: string;
  text: string;
  /** Position of the marker along the strip, px. */
  x: number;
}

export interface PlacedLabel {
  /** The markers this label stands for (one, or a group). */
  ids: string[];
  text: string;
  /** Centre of the label, px. */
  x: number;
  /** 0 = the row next to the strip. */
  row: number;
  /** Where the leader line meets the strip (the marker, or the middle of a group's bracket). */
  anchor: number;
  /** A group's bracket, from its first to its last marker. */
  from: number;
  to: number;
  group: boolean;
}

export interface LabelLayoutOptions {
  width: number;
  rows: number;
  /** Width of one character at the label's font size, px. */
  charWidth: number;
  /** Space kept between two labels (and between a label and a leader line), px. */
  gap: number;
}

export function labelWidth(text: string, o: Pick<LabelLayoutOptions, "charWidth">): number {
  return text.length * o.charWidth + 2;
}

function groupText(members: LabelItem[]): string {
  return members.length === 1 ? members[0].text : `${members[0].text}–${members[members.length - 1].text}`;
}

interface Span {
  left: number;
  right: number;
}

const overlaps = (spans: Span[], left: number, right: number) => spans.some((s) => s.left < right && left < s.right);

/** Lays out labels left to right; merges a label that fits nowhere with its neighbour into a group, and starts again. */
export function layoutLabels(items: readonly LabelItem[], o: LabelLayoutOptions): PlacedLabel[] {
  const sorted = [...items].sort((a, b) => a.x - b.x);
  let clusters: LabelItem[][] = sorted.map((i) => [i]);
  for (;;) {
    const labelsIn: Span[][] = Array.from({ length: o.rows }, () => []);
    const leadersIn: Span[][] = Array.from({ length: o.rows }, () => []);
    const placed: PlacedLabel[] = [];
    let failed = -1;
    for (let c = 0; c < clusters.length; c++) {
      const members = clusters[c];
      const text = groupText(members);
      const from = members[0].x;
      const to = members[members.length - 1].x;
      const anchor = (from + to) / 2;
      const w = labelWidth(text, o);
      const left = Math.min(Math.max(0, anchor - w / 2), Math.max(0, o.width - w));
      const right = left + w;
      let row = -1;
      for (let r = 0; r < o.rows && row < 0; r++) {
        if (overlaps(labelsIn[r], left - o.gap, right + o.gap) || overlaps(leadersIn[r], left - o.gap, right + o.gap)) continue;
        // The leader runs down through the rows nearer the strip: it must not cross a label there.
        let clear = true;
        for (let below = 0; below < r && clear; below++) clear = !overlaps(labelsIn[below], anchor - o.gap, anchor + o.gap);
        if (clear) row = r;
      }
      if (row < 0) {
        failed = c;
        break;
      }
      labelsIn[row].push({ left, right });
      for (let below = 0; below < row; below++) leadersIn[below].push({ left: anchor - 0.5, right: anchor + 0.5 });
      placed.push({ ids: members.map((m) => m.id), text, x: left + w / 2, row, anchor, from, to, group: members.length > 1 });
    }
    if (failed < 0) return placed;
    const merged = failed > 0 ? failed - 1 : 0;
    clusters = [...clusters.slice(0, merged), [...clusters[merged], ...clusters[merged + 1]], ...clusters.slice(merged + 2)];
  }
}
