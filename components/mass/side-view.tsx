import { useId } from "react";
import { formatQuantity } from "@/components/ui";
import { parseTyreSize } from "@/lib/tyres";
import type { MassFigures, PlatformFigures } from "./model";

/** Nominal tyre radius when the size is not known (common practice for a light 4WD: about 780 mm across). */
const DEFAULT_TYRE_RADIUS_MM = 390;

function tyreRadiusMm(size: string | null): number {
  if (!size) return DEFAULT_TYRE_RADIUS_MM;
  try {
    return parseTyreSize(size, "size").overallDiameterMm / 2;
  } catch {
    return DEFAULT_TYRE_RADIUS_MM;
  }
}

const kg = (v: number) => formatQuantity(Math.round(v), "kg");

type Mark = MassFigures["marks"][number];
export type MarkGroup = { xMm: number; massKg: number; status: Mark["status"]; load: boolean; labels: string[] };

/**
 * Items that sit within 100 mm of each other (a zone holds many) share one mark, so the drawing
 * stays legible; planned items, fitted items and the loading keep separate marks.
 */
export function groupMarks(marks: Mark[]): MarkGroup[] {
  const groups = new Map<string, MarkGroup & { moment: number }>();
  for (const m of marks) {
    const load = m.kind !== "item";
    const key = `${m.status}:${load}:${Math.round(m.xMm / 100)}`;
    const g = groups.get(key) ?? { xMm: m.xMm, massKg: 0, status: m.status, load, labels: [], moment: 0 };
    g.massKg += m.massKg;
    g.moment += m.massKg * m.xMm;
    g.labels.push(m.label);
    g.xMm = g.massKg > 0 ? g.moment / g.massKg : m.xMm;
    groups.set(key, g);
  }
  return [...groups.values()].map(({ moment: _moment, ...g }) => g).sort((a, b) => a.xMm - b.xMm);
}
const mm = (v: number) => formatQuantity(Math.round(v), "mm");

type Props = {
  fleetNumber: string;
  platform: PlatformFigures;
  figures: MassFigures;
  tyreSize: string | null;
};

/**
 * The vehicle from the side, drawn in millimetres: wheels on the wheelbase, every item as a mark
 * at its distance behind the front axle, the centre of mass, and each axle's load as a bar
 * against its rating. The numbered list under it says the same in words.
 */
export function SideView({ fleetNumber, platform, figures, tyreSize }: Props) {
  const titleId = useId();
  const descId = useId();
  const wb = platform.wheelbaseMm;
  if (!wb) {
    return <p className="text-muted">The side view needs the platform&apos;s wheelbase.</p>;
  }
  const r = tyreRadiusMm(tyreSize);
  const rearOverhang = platform.rearOverhangMm ?? 1000;
  const frontOverhang = 850;
  const marks = groupMarks(figures.marks);
  const xs = marks.map((m) => m.xMm);
  const xMin = Math.min(-frontOverhang, ...xs) - 350;
  const xMax = Math.max(wb + rearOverhang, ...xs) + 350;
  const top = -2750;
  const bottom = 1900;
  const width = xMax - xMin;

  const bodyBottom = -r - 120;
  const bodyTop = -r - 700;
  const cabTop = -1850;
  const cabFront = -frontOverhang + 500;
  const cabRear = wb * 0.55;

  const front = figures.checks.find((c) => c.limit === "front");
  const rear = figures.checks.find((c) => c.limit === "rear");
  const axles = [
    { name: "Front", x: 0, check: front, load: figures.frontKg },
    { name: "Rear", x: wb, check: rear, load: figures.rearKg },
  ];
  const barBase = bottom - 250;
  const barFull = 900; // the rating's height
  const barWidth = Math.min(700, wb / 4);

  const cg = figures.centreOfMassXMm;
  const markY = -2250;
  const desc =
    `Wheelbase ${mm(wb)}. ` +
    axles.map((a) => (a.load === undefined ? `${a.name} axle load unknown.` : `${a.name} axle ${kg(a.load)}${a.check ? ` of ${kg(a.check.capacityKg)} rated` : ""}.`)).join(" ") +
    (cg === null ? "" : ` Centre of mass ${mm(cg)} behind the front axle.`) +
    ` ${figures.marks.length} item${figures.marks.length === 1 ? "" : "s"} marked in ${marks.length} place${marks.length === 1 ? "" : "s"}.`;

  return (
    <figure className="flex flex-col gap-3">
      <svg
        viewBox={`${xMin} ${top} ${width} ${bottom - top}`}
        role="img"
        aria-labelledby={`${titleId} ${descId}`}
        className="h-auto max-h-[30rem] w-full rounded-md border border-line bg-surface-raised"
        data-testid="side-view"
      >
        <title id={titleId}>{`Side view of ${fleetNumber} with its loads`}</title>
        <desc id={descId}>{desc}</desc>

        {/* Ground */}
        <line x1={xMin} x2={xMax} y1={0} y2={0} className="stroke-line-strong" strokeWidth={20} />

        {/* Body: chassis and cab */}
        <rect x={-frontOverhang} y={bodyTop} width={wb + rearOverhang + frontOverhang} height={bodyBottom - bodyTop} rx={90} className="fill-surface-sunken stroke-line-strong" strokeWidth={18} />
        <path
          d={`M ${cabFront} ${bodyTop} L ${cabFront + 450} ${cabTop} L ${cabRear} ${cabTop} L ${cabRear} ${bodyTop} Z`}
          className="fill-surface stroke-line-strong"
          strokeWidth={18}
        />

        {/* Wheels */}
        {[0, wb].map((x) => (
          <g key={x}>
            <circle cx={x} cy={-r} r={r} className="fill-ink" />
            <circle cx={x} cy={-r} r={r * 0.45} className="fill-line" />
          </g>
        ))}

        {/* Wheelbase */}
        <g className="stroke-muted" strokeWidth={12}>
          <line x1={0} x2={wb} y1={230} y2={230} />
          <line x1={0} x2={0} y1={150} y2={310} />
          <line x1={wb} x2={wb} y1={150} y2={310} />
        </g>
        <text x={wb / 2} y={420} textAnchor="middle" fontSize={130} className="fill-muted">
          {`Wheelbase ${mm(wb)}`}
        </text>

        {/* Items at their positions */}
        {marks.map((m, i) => {
          const size = 70 + Math.min(80, Math.sqrt(Math.max(0, m.massKg)) * 7);
          const y = markY + (i % 2) * 330;
          const planned = m.status === "planned";
          return (
            <g key={`${m.labels[0]}-${i}`} data-planned={planned || undefined}>
              <line x1={m.xMm} x2={m.xMm} y1={y + size} y2={bodyTop} className={planned ? "stroke-accent" : "stroke-line-strong"} strokeWidth={10} strokeDasharray={planned ? "40 30" : undefined} />
              {planned ? (
                <path d={`M ${m.xMm} ${y - size} L ${m.xMm + size} ${y} L ${m.xMm} ${y + size} L ${m.xMm - size} ${y} Z`} className="fill-accent" />
              ) : !m.load ? (
                <circle cx={m.xMm} cy={y} r={size} className="fill-ok" />
              ) : (
                <rect x={m.xMm - size} y={y - size} width={size * 2} height={size * 2} className="fill-warn" />
              )}
              <text x={m.xMm} y={y + 40} textAnchor="middle" fontSize={110} fontWeight={700} className="fill-white">
                {i + 1}
              </text>
            </g>
          );
        })}

        {/* Centre of mass */}
        {cg !== null && (
          <g data-testid="centre-of-mass">
            <line x1={cg} x2={cg} y1={-r - 400} y2={0} className="stroke-danger" strokeWidth={12} strokeDasharray="30 30" />
            <circle cx={cg} cy={-r - 400} r={110} className="fill-white stroke-danger" strokeWidth={22} />
            <path d={`M ${cg - 110} ${-r - 400} H ${cg + 110} M ${cg} ${-r - 510} V ${-r - 290}`} className="stroke-danger" strokeWidth={22} />
            <text x={cg + 150} y={-r - 450} fontSize={120} fontWeight={700} className="fill-danger">
              Centre of mass
            </text>
          </g>
        )}

        {/* Axle loads against ratings */}
        {axles.map((a) => {
          if (a.load === undefined) return null;
          const rating = a.check?.capacityKg;
          const share = rating ? a.load / rating : 0;
          const h = Math.max(0, Math.min(1.3, share)) * barFull;
          const over = a.check ? !a.check.ok : false;
          return (
            <g key={a.name} data-testid={`axle-bar-${a.name.toLowerCase()}`}>
              <rect x={a.x - barWidth / 2} y={barBase - barFull} width={barWidth} height={barFull} className="fill-surface-sunken stroke-line-strong" strokeWidth={10} />
              <rect x={a.x - barWidth / 2} y={barBase - h} width={barWidth} height={h} className={over ? "fill-danger" : "fill-ok"} />
              {over && <rect x={a.x - barWidth / 2} y={barBase - h} width={barWidth} height={h - barFull} className="fill-danger-ink" />}
              <line x1={a.x - barWidth / 2 - 80} x2={a.x + barWidth / 2 + 80} y1={barBase - barFull} y2={barBase - barFull} className="stroke-ink" strokeWidth={16} strokeDasharray="40 25" />
              <text x={a.x + barWidth / 2 + 110} y={barBase - barFull / 2} fontSize={120} fontWeight={700} className={over ? "fill-danger" : "fill-ink"}>
                {`${a.name} ${kg(a.load)}`}
              </text>
              <text x={a.x + barWidth / 2 + 110} y={barBase - barFull / 2 + 150} fontSize={110} className="fill-muted">
                {rating ? `of ${kg(rating)} rated${over ? " — over" : ""}` : "rating not known"}
              </text>
            </g>
          );
        })}
      </svg>
      <figcaption className="flex flex-col gap-2 text-sm">
        <p className="text-muted">
          Marks sit at each item&apos;s distance behind the front axle: <span className="font-semibold text-ink">circles</span> are fitted items,{" "}
          <span className="font-semibold text-ink">diamonds</span> planned ones, <span className="font-semibold text-ink">squares</span> people, fluids and
          cargo. The bars below the axles fill to each axle&apos;s load; the dashed line is its rating.
        </p>
        {marks.length > 0 && (
          <ol className="grid grid-cols-1 gap-x-6 gap-y-1 md:grid-cols-2" aria-label="Items on the side view">
            {marks.map((m, i) => (
              <li key={`${m.labels[0]}-${i}`} className="flex gap-2 tabular-nums">
                <span className="w-6 shrink-0 text-right font-semibold">{i + 1}.</span>
                <span className="min-w-0 flex-1">
                  <span className="whitespace-nowrap font-medium">
                    {kg(m.massKg)} at {mm(m.xMm)}
                  </span>
                  {m.status === "planned" && <span className="font-semibold text-accent"> planned</span>}
                  <span className="block text-muted">{m.labels.length > 4 ? `${m.labels.slice(0, 4).join(", ")} and ${m.labels.length - 4} more` : m.labels.join(", ")}</span>
                </span>
              </li>
            ))}
          </ol>
        )}
      </figcaption>
    </figure>
  );
}
