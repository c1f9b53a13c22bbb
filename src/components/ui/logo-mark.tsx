/** A riveted nameplate with a small flame: Lifeplate's own mark. */
export function LogoMark({ className = 'h-8 w-8' }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true">
      <rect x="2" y="5" width="28" height="22" rx="5" fill="#A9844F" />
      <rect x="4.5" y="7.5" width="23" height="17" rx="3" fill="none" stroke="#23272B" strokeWidth="1.2" opacity=".35" />
      {[
        [6.5, 9.5],
        [25.5, 9.5],
        [6.5, 22.5],
        [25.5, 22.5],
      ].map(([cx, cy]) => (
        <circle key={`${cx}-${cy}`} cx={cx} cy={cy} r="1.2" fill="#23272B" />
      ))}
      <path d="M16 10.5c2.6 3 3.6 5 3.6 7a3.6 3.6 0 0 1-7.2 0c0-1.4.6-2.6 1.6-3.8.2 1.3.8 2 1.6 2.3-.4-1.8-.2-3.6.4-5.5z" fill="#F6F3EE" />
    </svg>
  );
}
