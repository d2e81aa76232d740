/**
 * A drawing of one sheet of a cut program: the sheet, the blanks, trim (scrap) and offcut, and
 * each stroke's cut line, as the shear core's piece flow placed them (`programLayout`, the same flow as
 * the check's yield). The drawing computes no geometry of its own,
 * so it always shows what the yield beside it counts. Groups named by a finding are drawn in the
 * fault colour; partial strokes are dashed. SVG's x is the sheet's length (along the blade) and its y
 * the sheet's width, so a rectangle's SVG `width` is its `length` and its SVG `height` its `width`.
 */
import type { LayoutReport } from "@/lib/shear";

const FILL = { blank: "#d5f0f0", scrap: "#fff3d6", offcut: "url(#offcut)" } as const;

export function CutDrawing({
  sheet,
  layout,
  units,
  faultyGroups = [],
  marks = [],
  reusable = [],
}: {
  sheet: { length: number; width: number };
  layout: LayoutReport | null;
  units: string;
  faultyGroups?: number[];
  /** labels written on the sheet (a plan's blanks), in the drawing's coordinates */
  marks?: { x: number; y: number; length: number; width: number; text: string }[];
  /** leftovers worth keeping, outlined */
  reusable?: { x: number; y: number; length: number; width: number }[];
}) {
  const rectangles = layout?.rectangles ?? [];
  const lines = layout?.cuts ?? [];
  const pad = Math.max(sheet.length, sheet.width) * 0.04;
  return (
    <figure className="rounded-md border border-scale-200 bg-white p-3">
      <svg
        viewBox={`${-pad} ${-pad} ${sheet.length + 2 * pad} ${sheet.width + 2 * pad}`}
        className="mx-auto block h-auto max-h-[32rem] w-full"
        role="img"
        aria-label={`One sheet, ${sheet.length} × ${sheet.width} ${units}, ${rectangles.filter((r) => r.kind === "blank").length} blanks, ${lines.length} strokes`}
      >
        <defs>
          <pattern
            id="offcut"
            width={pad / 2}
            height={pad / 2}
            patternUnits="userSpaceOnUse"
            patternTransform="rotate(45)"
          >
            <line x1="0" y1="0" x2="0" y2={pad / 2} stroke="#bcc3cc" strokeWidth={pad / 10} />
          </pattern>
        </defs>
        <rect
          x={0}
          y={0}
          width={sheet.length}
          height={sheet.width}
          fill="url(#offcut)"
          stroke="#161b22"
          strokeWidth={pad / 8}
        />
        {rectangles.map((piece, index) => (
          <rect
            key={index}
            data-kind={piece.kind}
            data-group={piece.group}
            data-stroke={piece.stroke ?? ""}
            x={piece.x}
            y={piece.y}
            width={piece.length}
            height={piece.width}
            fill={FILL[piece.kind]}
            stroke="#8d97a4"
            strokeWidth={pad / 20}
          />
        ))}
        {lines.map((line, index) => (
          <line
            key={index}
            data-group={line.group}
            data-stroke={line.stroke}
            x1={line.x1}
            y1={line.y1}
            x2={line.x2}
            y2={line.y2}
            stroke={faultyGroups.includes(line.group) ? "#b42318" : "#0a6267"}
            strokeWidth={pad / (faultyGroups.includes(line.group) ? 6 : 12)}
            strokeDasharray={line.partial ? `${pad / 4} ${pad / 6}` : undefined}
          />
        ))}
        {layout === null && (
          <text x={sheet.length / 2} y={sheet.width / 2} fontSize={pad} textAnchor="middle" fill="#5b6573">
            too many pieces to draw
          </text>
        )}
        {reusable.map((spare, index) => (
          <rect
            key={`r${index}`}
            x={spare.x}
            y={spare.y}
            width={spare.length}
            height={spare.width}
            fill="none"
            stroke="#7a5b00"
            strokeDasharray={`${pad / 4} ${pad / 6}`}
            strokeWidth={pad / 12}
          />
        ))}
        {marks.map((mark, index) => {
          const size = Math.min(mark.width * 0.35, mark.length / Math.max(4, mark.text.length * 0.62), pad * 0.7);
          return size >= pad * 0.22 ? (
            <text
              key={`m${index}`}
              x={mark.x + mark.length / 2}
              y={mark.y + mark.width / 2}
              fontSize={size}
              textAnchor="middle"
              dominantBaseline="middle"
              fill="#0b3a3d"
            >
              {mark.text}
            </text>
          ) : null;
        })}
        <text x={0} y={-pad / 3} fontSize={pad * 0.8} fill="#5b6573">
          blade side · {sheet.length} {units}
        </text>
      </svg>
      <figcaption className="mt-2 flex flex-wrap gap-4 text-xs text-ink-muted">
        <span>
          <i className="mr-1 inline-block h-2.5 w-2.5 bg-edge-light align-middle" />
          blanks
        </span>
        <span>
          <i className="mr-1 inline-block h-2.5 w-2.5 bg-caution-light align-middle" />
          trim (scrap)
        </span>
        <span>
          <svg width="10" height="10" viewBox="0 0 10 10" aria-hidden="true" className="mr-1 inline-block align-middle">
            <rect width="10" height="10" fill="#ffffff" stroke="#8d97a4" strokeWidth="1" />
            <path d="M-1 3L3 -1M-1 8L8 -1M2 11L11 2M7 11L11 7" stroke="#bcc3cc" strokeWidth="1.4" />
          </svg>
          offcut (hatched, as on the sheet)
        </span>
        {reusable.length > 0 && (
          <span>
            <i className="mr-1 inline-block h-2.5 w-2.5 border border-dashed border-caution align-middle" />
            reusable offcut
          </span>
        )}
        <span>
          <i className="mr-1 inline-block h-0.5 w-4 bg-fault align-middle" />
          cuts with a finding
        </span>
        {lines.some((line) => line.partial) && (
          <span>
            <i className="mr-1 inline-block h-0.5 w-4 border-t border-dashed border-edge align-middle" />
            partial strokes (sever nothing)
          </span>
        )}
      </figcaption>
    </figure>
  );
}
