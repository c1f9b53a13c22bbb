import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { LogoMark } from '@/components/ui/logo-mark';

/** The tag page is opened outside the signed-in shell (anyone may scan a tag), so it brings its own slim header. */
export function TagFrame({ children }: { children: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col">
      <header className="bg-header text-header-text">
        <div className="mx-auto flex max-w-5xl items-center gap-2 px-3 py-2 sm:px-6">
          <Link to="/" className="flex min-h-tap items-center gap-2 font-bold" aria-label="Lifeplate home">
            <LogoMark />
            <span className="text-lg">Lifeplate</span>
          </Link>
        </div>
      </header>
      <main className="flex-1">{children}</main>
    </div>
  );
}
