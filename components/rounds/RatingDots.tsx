import { BAND_TERMS } from './labels';

/**
 * One mechanism's ratings as dots on the 0…6 likelihood scale, stacked where reviewers agree,
 * with the engine's band as a hollow diamond above the axis (shown, not counted). For a coach
 * who would rather look than read; the numbers are in the table beside it.
 */
export function RatingDots({
  bands,
  engineBand,
  label,
}: {
  bands: number[];
  engineBand?: number | null;
  label: string;
}) {
  const width = 224;
  const left = 12;
  const step = (width - 2 * left) / 6;
  const x = (band: number) => left + band * step;
  const stacks = new Map<number, number>();
  const dots = bands.map((band) => {
    const level = stacks.get(band) ?? 0;
    stacks.set(band, level + 1);
    return { band, level };
  });
  const summary = `${label}: ratings ${bands.join(', ') || 'none'} on 0 to 6${
    engineBand !== undefined && engineBand !== null ? `; engine band ${engineBand} (${BAND_TERMS[engineBand]})` : ''
  }.`;
  return (
    <svg viewBox={`0 0 ${width} 64`} className="h-16 w-full max-w-60" role="img" aria-label={summary}>
      <line x1={left} x2={width - left} y1={44} y2={44} className="stroke-chalk-400" strokeWidth="1.5" />
      {BAND_TERMS.map((term, band) => (
        <g key={term}>
          <line x1={x(band)} x2={x(band)} y1={41} y2={47} className="stroke-chalk-400" strokeWidth="1.5" />
          <text x={x(band)} y={60} textAnchor="middle" className="fill-ink-muted text-[10px]">
            {band}
          </text>
        </g>
      ))}
      {engineBand !== undefined && engineBand !== null && (
        <path
          d={`M ${x(engineBand)} 4 l 5 5 l -5 5 l -5 -5 z`}
          className="fill-paper-raised stroke-rope-600"
          strokeWidth="1.8"
        />
      )}
      {dots.map((d, i) => (
        <circle
          key={i}
          cx={x(d.band)}
          cy={36 - d.level * 9}
          r={4}
          className="fill-granite-700 stroke-paper-raised"
          strokeWidth="1"
        />
      ))}
    </svg>
  );
}
