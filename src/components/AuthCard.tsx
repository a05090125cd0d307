import type { ReactNode } from "react";
import { Wordmark } from "./Wordmark";

/** The frame of the signed-out pages: the mark, a card, and a line on what Kerf is for. */
export function AuthCard({ title, children, footer }: { title: string; children: ReactNode; footer?: ReactNode }) {
  return (
    <main className="flex min-h-screen flex-col items-center justify-center gap-6 bg-[repeating-linear-gradient(90deg,var(--color-ply-100)_0_46px,var(--color-ply-200)_46px_47px)] p-6">
      <Wordmark className="text-2xl" />
      <section className="w-full max-w-md rounded-xl border border-ply-300 bg-white p-8 shadow-sm">
        <h1 className="mb-6 text-xl font-bold">{title}</h1>
        {children}
      </section>
      {footer && <div className="text-sm text-graphite-700">{footer}</div>}
      <p className="max-w-md text-center text-xs text-graphite-500">From the challenge to the published video: test plans, bench numbers, footage and sponsor dates on one episode.</p>
    </main>
  );
}
