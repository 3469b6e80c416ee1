import { Link } from "react-router";

export function Wordmark() {
  return (
    <Link to="/" className="flex items-center gap-2 text-ink no-underline" aria-label="Eonscale home">
      <svg width="28" height="28" viewBox="0 0 32 32" aria-hidden="true">
        <rect width="32" height="32" rx="6" fill="#1f2430" />
        <rect x="5" y="8" width="22" height="3" fill="#f3e0c7" />
        <rect x="5" y="14.5" width="15" height="3" fill="#b8692e" />
        <rect x="5" y="21" width="7" height="3" fill="#3d6b7a" />
      </svg>
      <span className="font-serif text-xl font-semibold">Eonscale</span>
    </Link>
  );
}
