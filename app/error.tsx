"use client";

import { UnavailableNotice, type ErrorBoundaryProps } from "@/components/ui/unavailable-notice";

/**
 * The dashboard's layout itself failed (it reads the session's memberships, so this is what a
 * database outage shows): the calm notice on a page of its own.
 */
export default function LayoutError(props: ErrorBoundaryProps) {
  return (
    <main id="main" className="mx-auto max-w-lg p-10">
      <UnavailableNotice {...props} />
    </main>
  );
}
