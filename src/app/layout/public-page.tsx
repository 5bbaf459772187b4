import type * as React from 'react';

/** The frame of the pages a person sees without a session: the product name, a heading and one card. */
export function PublicPage({
  title,
  heading,
  children,
}: {
  title: string;
  heading: string;
  children: React.ReactNode;
}) {
  return (
    <main id="main" className="flex min-h-screen items-start justify-center bg-stone-100 px-4 py-16">
      <title>{`${title} · Tallyard`}</title>
      <div className="w-full max-w-md">
        <p className="mb-6 text-center text-2xl font-semibold tracking-tight text-spruce-900">Tallyard</p>
        <div className="rounded-lg border border-stone-200 bg-white p-6 shadow-sm">
          <h1 className="mb-4 text-lg font-semibold">{heading}</h1>
          {children}
        </div>
      </div>
    </main>
  );
}
