import type { ReactNode } from 'react';
import { LogoMark } from '@/components/ui/logo-mark';

/** A small page of its own, outside the office shell: an invited person has no menu yet. */
export function WelcomeFrame({ title, children }: { title: string; children: ReactNode }) {
  return (
    <main className="mx-auto flex min-h-screen max-w-md flex-col justify-center gap-5 px-4 py-8">
      <div className="flex items-center gap-3">
        <LogoMark className="h-10 w-10" />
        <p className="text-xl font-bold">Lifeplate</p>
      </div>
      <section className="flex flex-col gap-4 rounded-plate border border-plate-line bg-surface p-5">
        <h1 className="text-2xl font-bold">{title}</h1>
        {children}
      </section>
    </main>
  );
}
