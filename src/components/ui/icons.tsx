/** Small inline icons (no emoji: a phone or a server without an emoji font would show empty boxes). */
import type { ReactElement } from 'react';
export type IconName = 'check' | 'clock' | 'alert' | 'stop' | 'info' | 'caution' | 'round' | 'find' | 'scan' | 'more';

const paths: Record<IconName, ReactElement> = {
  check: <path d="M4 10.5l4 4 8-9" fill="none" stroke="currentColor" strokeWidth="2.4" strokeLinecap="round" strokeLinejoin="round" />,
  clock: (
    <>
      <circle cx="10" cy="10" r="7.5" fill="none" stroke="currentColor" strokeWidth="2" />
      <path d="M10 5.5V10l3 2" fill="none" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
    </>
  ),
  alert: (
    <>
      <circle cx="10" cy="10" r="8" fill="currentColor" />
      <path d="M10 5.5v5.5" stroke="#fff" strokeWidth="2.4" strokeLinecap="round" />
      <circle cx="10" cy="14.3" r="1.3" fill="#fff" />
    </>
  ),
  stop: (
    <>
      <path d="M6.7 1.5h6.6l5.2 5.2v6.6l-5.2 5.2H6.7l-5.2-5.2V6.7z" fill="currentColor" />
      <path d="M6.5 10h7" stroke="#fff" strokeWidth="2.6" strokeLinecap="round" />
    </>
  ),
  info: (
    <>
      <circle cx="10" cy="10" r="7.5" fill="none" stroke="currentColor" strokeWidth="2" />
      <path d="M10 9v5" stroke="currentColor" strokeWidth="2.2" strokeLinecap="round" />
      <circle cx="10" cy="6.2" r="1.2" fill="currentColor" />
    </>
  ),
  caution: (
    <>
      <path d="M10 2L19 17.5H1z" fill="currentColor" />
      <path d="M10 7.5v5" stroke="#fff" strokeWidth="2.2" strokeLinecap="round" />
      <circle cx="10" cy="15" r="1.2" fill="#fff" />
    </>
  ),
  round: (
    <>
      <rect x="4" y="2.5" width="12" height="15" rx="1.5" fill="none" stroke="currentColor" strokeWidth="2" />
      <path d="M7 7h6M7 10.5h6M7 14h3.5" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" />
    </>
  ),
  find: (
    <>
      <circle cx="8.5" cy="8.5" r="5.5" fill="none" stroke="currentColor" strokeWidth="2.2" />
      <path d="M12.7 12.7L17.5 17.5" stroke="currentColor" strokeWidth="2.4" strokeLinecap="round" />
    </>
  ),
  scan: (
    <>
      <path d="M2.5 7V3.5a1 1 0 011-1H7M13 2.5h3.5a1 1 0 011 1V7M17.5 13v3.5a1 1 0 01-1 1H13M7 17.5H3.5a1 1 0 01-1-1V13" fill="none" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
      <rect x="6.5" y="6.5" width="7" height="7" fill="currentColor" />
    </>
  ),
  more: (
    <>
      <circle cx="4" cy="10" r="1.8" fill="currentColor" />
      <circle cx="10" cy="10" r="1.8" fill="currentColor" />
      <circle cx="16" cy="10" r="1.8" fill="currentColor" />
    </>
  ),
};

export function Icon({ name, className = 'h-4 w-4' }: { name: IconName; className?: string }) {
  return (
    <svg viewBox="0 0 20 20" className={`inline-block shrink-0 ${className}`} aria-hidden="true">
      {paths[name]}
    </svg>
  );
}
