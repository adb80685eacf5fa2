/**
 * The run review's charts in plain SVG, with axes and labels: the distribution
 * of satisfaction (a histogram of ten bins) and satisfaction against seniority
 * (a scatter, most senior on the left).
 */
const W = 420;
const H = 220;
const M = { left: 54, right: 12, top: 14, bottom: 40 };
const plotW = W - M.left - M.right;
const plotH = H - M.top - M.bottom;

function Axes({ xLabel, yLabel, xTicks, yTicks }: { xLabel: string; yLabel: string; xTicks: { at: number; label: string }[]; yTicks: { at: number; label: string }[] }) {
  return (
    <g className="text-slate-600" fontSize="11" fill="currentColor">
      <line x1={M.left} y1={M.top + plotH} x2={M.left + plotW} y2={M.top + plotH} stroke="currentColor" />
      <line x1={M.left} y1={M.top} x2={M.left} y2={M.top + plotH} stroke="currentColor" />
      {xTicks.map((t) => (
        <g key={`x${t.at}`}>
          <line x1={M.left + t.at * plotW} y1={M.top + plotH} x2={M.left + t.at * plotW} y2={M.top + plotH + 4} stroke="currentColor" />
          <text x={M.left + t.at * plotW} y={M.top + plotH + 16} textAnchor="middle">
            {t.label}
          </text>
        </g>
      ))}
      {yTicks.map((t) => (
        <g key={`y${t.at}`}>
          <line x1={M.left - 4} y1={M.top + plotH - t.at * plotH} x2={M.left} y2={M.top + plotH - t.at * plotH} stroke="currentColor" />
          <text x={M.left - 7} y={M.top + plotH - t.at * plotH + 4} textAnchor="end">
            {t.label}
          </text>
        </g>
      ))}
      <text x={M.left + plotW / 2} y={H - 6} textAnchor="middle">
        {xLabel}
      </text>
      <text x={12} y={M.top + plotH / 2} textAnchor="middle" transform={`rotate(-90 12 ${M.top + plotH / 2})`}>
        {yLabel}
      </text>
    </g>
  );
}

const fractionTicks = [0, 0.25, 0.5, 0.75, 1].map((at) => ({ at, label: at.toFixed(2) }));

/** Crew per satisfaction bin [0, 0.1), …, [0.9, 1]. */
export function SatisfactionHistogram({ satisfactions }: { satisfactions: readonly number[] }) {
  const bins = new Array<number>(10).fill(0);
  for (const s of satisfactions) bins[Math.min(9, Math.floor(s * 10))]!++;
  const top = Math.max(1, ...bins);
  const step = Math.max(1, Math.ceil(top / 4));
  const yTicks = Array.from({ length: Math.floor(top / step) + 1 }, (_, k) => ({ at: (k * step) / top, label: String(k * step) }));
  return (
    <figure className="rounded-lg border border-slate-200 bg-white p-3">
      <figcaption className="text-sm font-medium">Distribution of satisfaction</figcaption>
      <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-label="Histogram: crew members per satisfaction band" className="mt-1 w-full">
        {bins.map((count, b) => (
          <rect key={b} x={M.left + (b / 10) * plotW + 1} y={M.top + plotH - (count / top) * plotH} width={plotW / 10 - 2} height={(count / top) * plotH} className="fill-sky-600">
            <title>{`${(b / 10).toFixed(1)}–${((b + 1) / 10).toFixed(1)}: ${count} crew`}</title>
          </rect>
        ))}
        <Axes xLabel="Satisfaction" yLabel="Crew members" xTicks={fractionTicks} yTicks={yTicks} />
      </svg>
    </figure>
  );
}

/** One dot per crew member: seniority place (1 = most senior) against satisfaction. */
export function SatisfactionBySeniority({ points }: { points: readonly { seniority: number; satisfaction: number; name: string }[] }) {
  const ranked = [...points].sort((a, b) => a.seniority - b.seniority);
  const n = Math.max(1, ranked.length - 1);
  // Ticks at whole seniority places: every place for a few crew, else five spread evenly.
  const places = ranked.length <= 10 ? ranked.map((_, k) => k + 1) : [...new Set([0, 0.25, 0.5, 0.75, 1].map((f) => Math.round(f * n) + 1))];
  const xTicks = places.map((place) => ({ at: ranked.length === 1 ? 0.5 : (place - 1) / n, label: String(place) }));
  return (
    <figure className="rounded-lg border border-slate-200 bg-white p-3">
      <figcaption className="text-sm font-medium">Satisfaction by seniority</figcaption>
      <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-label="Scatter: satisfaction of each crew member by seniority place" className="mt-1 w-full">
        {ranked.map((p, k) => (
          <circle key={p.seniority} cx={M.left + (ranked.length === 1 ? 0.5 : k / n) * plotW} cy={M.top + plotH - p.satisfaction * plotH} r={4} className="fill-sky-700 opacity-80">
            <title>{`${p.name} (place ${k + 1}): ${p.satisfaction.toFixed(2)}`}</title>
          </circle>
        ))}
        <Axes xLabel="Seniority place (1 = most senior)" yLabel="Satisfaction" xTicks={xTicks} yTicks={fractionTicks} />
      </svg>
    </figure>
  );
}
