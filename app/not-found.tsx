import Link from "next/link";

export default function NotFound() {
  return (
    <main className="mx-auto max-w-lg px-4 py-16">
      <h1 className="text-xl font-semibold">Not found</h1>
      <p className="mt-2 text-sm text-muted">
        There is nothing here, or it belongs to another team, or your role does not show it.
      </p>
      <Link href="/home" className="mt-4 inline-block text-accent underline">
        Go to the home page
      </Link>
    </main>
  );
}
