import type { ReactNode } from "react";

import { requirePage } from "@/lib/server/auth/guards";

type ReviewLayoutProps = { children: ReactNode };

/**
 * Access is decided here, above the route's loading boundary: the redirect to sign-in and the 403
 * page keep their status codes, while the queue streams in behind loading.tsx.
 */
export default async function ReviewLayout({ children }: ReviewLayoutProps) {
  await requirePage("/review");
  return <>{children}</>;
}
