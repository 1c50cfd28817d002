import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { BrandMark } from '@/components/ui/brand-mark';
import { paths } from '@/config/paths';

/** The frame of the pages reached from a link in a message, for people who are not signed in. */
export function PublicPage({ title, children }: { title: string; children: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col bg-paper-50">
      <header className="bg-lagoon-900">
        <div className="mx-auto flex max-w-3xl items-center px-4 py-3">
          <Link to={paths.signIn.href()} className="flex items-center gap-2 text-lg font-semibold text-white">
            <BrandMark />
            Kcatalog
          </Link>
        </div>
      </header>
      <main id="main" className="flex flex-1 items-start justify-center px-4 py-12">
        <div className="w-full max-w-md space-y-5 rounded-lg border border-paper-200 bg-white p-6 shadow-card">
          <h1 className="text-2xl font-semibold tracking-tight text-ink-900">{title}</h1>
          {children}
        </div>
      </main>
      <footer className="py-3 text-center text-xs text-ink-500">For research use only.</footer>
    </div>
  );
}
