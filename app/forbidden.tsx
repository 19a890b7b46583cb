import Link from "next/link";

export default function Forbidden() {
  return (
    <main className="mx-auto max-w-lg p-10">
      <h1 className="text-lg font-semibold">Not available to your role</h1>
      <p className="mt-2 text-ink-soft">
        Your role in this organization does not include this area. An administrator can change roles on the People
        page.
      </p>
      <Link className="mt-4 inline-block text-action underline" href="/schedules">
        Back to schedules
      </Link>
    </main>
  );
}
