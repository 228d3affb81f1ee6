/**
 * A quiet drawing for the sign-in page: modal damping against wind speed, one branch staying damped and one
 * crossing zero, drawn warm past the crossing — what the product exists to find.
 */
export function SignInFigure({ className }: { className?: string }) {
  return (
    <svg viewBox="0 0 320 180" className={className} aria-hidden="true" fill="none">
      <g stroke="#28474e" strokeWidth="1">
        {[30, 60, 90, 120, 150].map((y) => (
          <line key={y} x1="24" x2="304" y1={y} y2={y} strokeDasharray="2 4" />
        ))}
      </g>
      <line x1="24" x2="304" y1="96" y2="96" stroke="#7f9a9e" strokeWidth="1.2" />
      <line x1="24" x2="24" y1="18" y2="166" stroke="#7f9a9e" strokeWidth="1.2" />
      <path d="M24 70 C 90 58, 150 44, 304 30" stroke="#7fb3b5" strokeWidth="2" />
      <path d="M24 80 C 100 74, 170 78, 226 96" stroke="#a9cfcf" strokeWidth="2" />
      <path d="M226 96 C 250 104, 276 122, 304 146" stroke="#e07a3c" strokeWidth="2.4" />
      <circle cx="226" cy="96" r="4.5" fill="#12262b" stroke="#e07a3c" strokeWidth="2" />
    </svg>
  );
}
