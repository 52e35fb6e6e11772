import type { StudLayout } from "~/lib/records/sequence";

// The tightening sequence drawn as the head is seen from above: bores as circles, each stud as a
// numbered disc in the order it is tightened (centre outward, alternating sides). One drawing per bank.
export function StudSequence({ layout, bank }: { layout: StudLayout; bank: number }) {
  const pitch = 100;
  const pad = 40;
  const w = layout.boresPerBank * pitch + 2 * pad;
  const h = 230;
  const studs = layout.studs.filter((s) => s.bank === bank);
  return (
    <svg
      viewBox={`0 0 ${w} ${h}`}
      role="img"
      aria-label={`Tightening sequence${layout.banks > 1 ? `, bank ${bank === 0 ? "A" : "B"}` : ""}: ${[...studs]
        .sort((a, b) => a.order - b.order)
        .map((s) => `${s.order}. ${s.label}`)
        .join(", ")}`}
      className="h-auto w-full max-w-3xl"
    >
      <rect x={pad - 25} y={30} width={w - 2 * pad + 50} height={h - 60} rx={12} fill="none" stroke="#2b4456" strokeWidth={2} />
      {Array.from({ length: layout.boresPerBank }, (_, i) => (
        <g key={i}>
          <circle cx={pad + (i + 0.5) * pitch} cy={h / 2} r={38} fill="#f3efe9" stroke="#2b4456" strokeWidth={1.5} />
          <text x={pad + (i + 0.5) * pitch} y={h / 2 + 5} textAnchor="middle" fontSize={14} fill="#2b4456">
            Cyl {bank * layout.boresPerBank + i + 1}
          </text>
        </g>
      ))}
      {studs.map((s) => {
        const cx = pad + s.x * pitch;
        const cy = s.side === 0 ? 48 : h - 48;
        return (
          <g key={s.index}>
            <circle cx={cx} cy={cy} r={15} fill="#a4521f" />
            <text x={cx} y={cy + 5} textAnchor="middle" fontSize={14} fontWeight="bold" fill="#fff">
              {s.order}
            </text>
            <text x={cx} y={s.side === 0 ? 20 : h - 8} textAnchor="middle" fontSize={10} fill="#2b4456">
              {s.label}
            </text>
          </g>
        );
      })}
    </svg>
  );
}
