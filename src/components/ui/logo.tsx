/** Grisaille's mark: five steps of the zone ramp. */
export function Logo({ size = 20 }: { size?: number }) {
  const steps = ['#000', '#303030', '#5e5e5e', '#919191', '#c6c6c6'];
  return (
    <svg width={size} height={size} viewBox="0 0 20 20" aria-hidden="true">
      {steps.map((c, i) => (
        <rect key={c} x={i * 4} y={2} width={4} height={16} fill={c} />
      ))}
    </svg>
  );
}
