/**
 * A drawing of one sheet of a cut program: the sheet, each stroke's cut line, the pieces of
 * every group, and the offcut. Groups named by a finding are drawn in the fault colour.
 * Follows the program's piece flow: a group cuts strips off its workpieces against the
 * backgauge; a turned group takes the pieces of the group before it (or of group `from`),
 * turned 90°, so its strokes run across the other way.
 */
interface Cut { backgauge: number; count: number; turn?: boolean; from?: number; scrap?: boolean }
interface Rect { x: number; y: number; w: number; h: number }
interface Piece extends Rect { group: number }
type Axis = "y" | "x"; // y: strokes across the sheet's width; x: strokes along its length

const TOLERANCE = 1e-6;

export function layoutSheet(sheet: { length: number; width: number }, cuts: Cut[]) {
  let axis: Axis = "y";
  let workpieces: Rect[] = [{ x: 0, y: 0, w: sheet.length, h: sheet.width }];
  const made: { pieces: Piece[]; axis: Axis; turned: boolean }[] = [];
  const offcut: Rect[] = [];
  const lines: { x1: number; y1: number; x2: number; y2: number; group: number }[] = [];
  cuts.forEach((cut, group) => {
    if (cut.turn && group === 0) axis = "x";
    else if (cut.turn) {
      offcut.push(...workpieces);
      const source = made[cut.from ?? group - 1];
      if (source && !source.turned) {
        source.turned = true;
        workpieces = source.pieces;
        axis = source.axis === "y" ? "x" : "y";
      } else workpieces = [];
    }
    const pieces: Piece[] = [];
    const remnants: Rect[] = [];
    for (const wp of workpieces) {
      let rest = { ...wp };
      for (let s = 0; s < cut.count; s++) {
        const size = axis === "y" ? rest.h : rest.w;
        if (cut.backgauge >= size - TOLERANCE) break;
        if (axis === "y") {
          pieces.push({ x: rest.x, y: rest.y, w: rest.w, h: cut.backgauge, group });
          lines.push({ x1: rest.x, y1: rest.y + cut.backgauge, x2: rest.x + rest.w, y2: rest.y + cut.backgauge, group });
          rest = { ...rest, y: rest.y + cut.backgauge, h: rest.h - cut.backgauge };
        } else {
          pieces.push({ x: rest.x, y: rest.y, w: cut.backgauge, h: rest.h, group });
          lines.push({ x1: rest.x + cut.backgauge, y1: rest.y, x2: rest.x + cut.backgauge, y2: rest.y + rest.h, group });
          rest = { ...rest, x: rest.x + cut.backgauge, w: rest.w - cut.backgauge };
        }
      }
      const left = axis === "y" ? rest.h : rest.w;
      if (Math.abs(left - cut.backgauge) < 1e-3) pieces.push({ ...rest, group });
      else if (left > TOLERANCE) remnants.push(rest);
    }
    made.push({ pieces, axis, turned: false });
    workpieces = remnants;
  });
  offcut.push(...workpieces);
  // Pieces that a turned group cuts up are not final: their parts and leftovers are.
  const finalPieces = made.filter((m) => !m.turned).flatMap((m) => m.pieces);
  return { pieces: made.flatMap((m) => m.pieces), finalPieces, lines, offcut };
}

export function CutDrawing({ sheet, cuts, units, faultyGroups = [], marks = [], reusable = [] }: {
  sheet: { length: number; width: number }; cuts: Cut[]; units: string; faultyGroups?: number[];
  /** labels written on the sheet (a plan's blanks), in the drawing's coordinates */
  marks?: { x: number; y: number; w: number; h: number; text: string }[];
  /** leftovers worth keeping, outlined */
  reusable?: { x: number; y: number; w: number; h: number }[];
}) {
  const { finalPieces, lines } = layoutSheet(sheet, cuts);
  const pad = Math.max(sheet.length, sheet.width) * 0.04;
  return (
    <figure className="rounded-md border border-scale-200 bg-white p-3">
      <svg viewBox={`${-pad} ${-pad} ${sheet.length + 2 * pad} ${sheet.width + 2 * pad}`} className="mx-auto block h-auto max-h-[32rem] w-full" role="img"
        aria-label={`One sheet, ${sheet.length} × ${sheet.width} ${units}, cut in ${cuts.length} groups`}>
        <defs>
          <pattern id="offcut" width={pad / 2} height={pad / 2} patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
            <line x1="0" y1="0" x2="0" y2={pad / 2} stroke="#bcc3cc" strokeWidth={pad / 10} />
          </pattern>
        </defs>
        <rect x={0} y={0} width={sheet.length} height={sheet.width} fill="url(#offcut)" stroke="#161b22" strokeWidth={pad / 8} />
        {finalPieces.map((p, i) => (
          <rect key={i} x={p.x} y={p.y} width={p.w} height={p.h}
            fill={cuts[p.group]?.scrap ? "#fff3d6" : "#d5f0f0"}
            stroke="#8d97a4" strokeWidth={pad / 20} />
        ))}
        {lines.map((l, i) => (
          <line key={i} {...l} stroke={faultyGroups.includes(l.group) ? "#b42318" : "#0a6267"} strokeWidth={pad / (faultyGroups.includes(l.group) ? 6 : 12)} />
        ))}
        {reusable.map((r, i) => (
          <rect key={`r${i}`} x={r.x} y={r.y} width={r.w} height={r.h} fill="none" stroke="#7a5b00" strokeDasharray={`${pad / 4} ${pad / 6}`} strokeWidth={pad / 12} />
        ))}
        {marks.map((m, i) => {
          const size = Math.min(m.h * 0.35, m.w / Math.max(4, m.text.length * 0.62), pad * 0.7);
          return size >= pad * 0.22 ? (
            <text key={`m${i}`} x={m.x + m.w / 2} y={m.y + m.h / 2} fontSize={size} textAnchor="middle" dominantBaseline="middle" fill="#0b3a3d">{m.text}</text>
          ) : null;
        })}
        <text x={0} y={-pad / 3} fontSize={pad * 0.8} fill="#5b6573">blade side · {sheet.length} {units}</text>
      </svg>
      <figcaption className="mt-2 flex flex-wrap gap-4 text-xs text-ink-muted">
        <span><i className="mr-1 inline-block h-2.5 w-2.5 bg-edge-light align-middle" />blanks</span>
        <span><i className="mr-1 inline-block h-2.5 w-2.5 bg-caution-light align-middle" />trim (scrap)</span>
        <span><i className="mr-1 inline-block h-2.5 w-2.5 bg-scale-300 align-middle" />offcut</span>
        {reusable.length > 0 && <span><i className="mr-1 inline-block h-2.5 w-2.5 border border-dashed border-caution align-middle" />reusable offcut</span>}
        <span><i className="mr-1 inline-block h-0.5 w-4 bg-fault align-middle" />cuts with a finding</span>
      </figcaption>
    </figure>
  );
}
