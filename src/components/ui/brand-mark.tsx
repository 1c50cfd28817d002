/** Our mark: a saturation curve rising off its baseline, with the half-saturation point in the accent colour. */
export function BrandMark({ className = 'size-7' }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden focusable="false">
      <rect width="32" height="32" rx="7" className="fill-lagoon-800" />
      <path d="M6 25 C 9 12, 14 9, 26 8" fill="none" className="stroke-paper-100" strokeWidth="2.6" strokeLinecap="round" />
      <path d="M6 25 H26" className="stroke-lagoon-300" strokeWidth="1.4" strokeLinecap="round" />
      <circle cx="11.5" cy="15" r="2.6" className="fill-ember-400" />
    </svg>
  );
}
