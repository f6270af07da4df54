/** Our mark: a bearing ring with a drop in its bore. */
export function Logo({ size = 28 }: { size?: number }) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden="true" focusable="false">
      <circle cx="16" cy="16" r="13" fill="none" stroke="currentColor" strokeWidth="3" />
      <circle cx="16" cy="16" r="8" fill="none" stroke="currentColor" strokeWidth="1.5" strokeDasharray="2.5 2.5" />
      <path d="M16 10.5c2.6 3.3 3.6 5.2 3.6 6.7a3.6 3.6 0 0 1-7.2 0c0-1.5 1-3.4 3.6-6.7z" fill="#f6e6c8" />
    </svg>
  );
}
