// The caution shown beside every result (PRODUCT.md, "Cautions").
export function Caution({ className = "" }: { className?: string }) {
  return (
    <p className={`border-l-2 border-copper/60 pl-3 text-xs leading-relaxed text-ink/70 ${className}`}>
      Linear, small-signal idealisation. Verify against measurement, component ratings and the codes and licensed
      practice that apply before building hardware, above all at mains or high voltage.
    </p>
  );
}
