"use client";

import { UnavailableNotice, type ErrorBoundaryProps } from "@/components/ui/unavailable-notice";

/** A page under the dashboard layout failed on our side: the calm notice, with the navigation kept. */
export default function PageError(props: ErrorBoundaryProps) {
  return <UnavailableNotice {...props} />;
}
