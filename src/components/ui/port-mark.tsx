// The product's mark: two open port terminals in copper, as drawn on every schematic.
export function PortMark({ className = "h-5 w-8" }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 20" className={className} aria-hidden="true">
      <path d="M1 10h9M22 10h9" stroke="currentColor" strokeWidth="1.5" />
      <circle cx="13" cy="10" r="3" fill="none" stroke="#B5562B" strokeWidth="1.5" />
      <circle cx="19" cy="10" r="3" fill="none" stroke="#B5562B" strokeWidth="1.5" />
    </svg>
  );
}
