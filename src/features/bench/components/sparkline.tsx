/** A small spectral sparkline: values on the 350–900 nm grid, scaled to their peak (or to 1 for transmittances). */
export function Sparkline({ values, fixedMax, label, width = 120, height = 28 }: { values: number[]; fixedMax?: number; label: string; width?: number; height?: number }) {
  if (!values.length) return null;
  const top = fixedMax ?? Math.max(1e-12, ...values);
  const step = width / (values.length - 1);
  const pts = values.map((v, i) => `${(i * step).toFixed(1)},${(height - 1 - (Math.min(1, Math.max(0, v / top)) * (height - 2))).toFixed(1)}`);
  return (
    <svg width={width} height={height} viewBox={`0 0 ${width} ${height}`} role="img" aria-label={label} className="shrink-0">
      <defs>
        <linearGradient id="spark-band" x1="0" x2="1">
          <stop offset="0" stopColor="#7a5bb0" />
          <stop offset="0.25" stopColor="#3b7fc4" />
          <stop offset="0.45" stopColor="#3f9a5a" />
          <stop offset="0.6" stopColor="#d2b93b" />
          <stop offset="0.78" stopColor="#d2692f" />
          <stop offset="1" stopColor="#a22a2e" />
        </linearGradient>
      </defs>
      <polygon points={`0,${height} ${pts.join(' ')} ${width},${height}`} fill="url(#spark-band)" opacity="0.25" />
      <polyline points={pts.join(' ')} fill="none" stroke="#1b1a18" strokeWidth="1.25" />
    </svg>
  );
}
