import Link from "next/link";

export default function NotFound() {
  return (
    <main className="mx-auto max-w-lg p-10">
      <h1 className="text-lg font-semibold">Not found</h1>
      <p className="mt-2 text-ink-soft">There is nothing at this address, or it belongs to another organization.</p>
      <Link className="mt-4 inline-block text-action underline" href="/">
        Go to Sagline
      </Link>
    </main>
  );
}
