/**
 * Nestkeeper's mark: a reference sphere resting in a three-point nest seat,
 * drawn as a brass ball on two ink cradle arms over a base line.
 */
export function BrandMark({ size = 28, className = '' }: { size?: number; className?: string }) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden="true" focusable="false" className={className}>
      <circle cx="16" cy="12.5" r="7" fill="#b08d3c" />
      <circle cx="13.6" cy="10.2" r="2" fill="#f1e6c9" opacity="0.9" />
      <path d="M5 14.5 L13 24 H19 L27 14.5" fill="none" stroke="currentColor" strokeWidth="2.6" strokeLinejoin="round" strokeLinecap="round" />
      <path d="M8 28 H24" stroke="currentColor" strokeWidth="2.6" strokeLinecap="round" />
    </svg>
  );
}

/** The mark with the product name beside it. */
export function Wordmark({ className = '', size = 28 }: { className?: string; size?: number }) {
  return (
    <span className={`inline-flex items-center gap-2 ${className}`}>
      <BrandMark size={size} />
      <span className="font-semibold tracking-tight" style={{ fontSize: size * 0.72 }}>
        Nestkeeper
      </span>
    </span>
  );
}
