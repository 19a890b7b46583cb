import type { ReactNode } from "react";

export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <main className="flex min-h-screen items-start justify-center px-4 pt-24">
      <div className="w-full max-w-sm">
        <p className="mb-6 text-center text-xl font-semibold tracking-tight">
          Sag<span className="text-action">line</span>
        </p>
        <div className="rounded border border-rule bg-sheet p-6 shadow-sm">{children}</div>
        <p className="mt-4 text-center text-xs text-ink-soft">Serviceability screening for member schedules</p>
      </div>
    </main>
  );
}
