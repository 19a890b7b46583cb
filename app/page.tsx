import { redirect } from "next/navigation";

import { getRequestContext } from "@/lib/server/auth/request-context";

export default async function HomePage() {
  const context = await getRequestContext();
  redirect(context ? "/schedules" : "/sign-in");
}
