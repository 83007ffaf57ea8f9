import Link from "next/link";

export default function NotFound() {
  return (
    <main className="mx-auto flex max-w-xl flex-col gap-4 px-4 py-16">
      <p className="text-sm font-semibold uppercase tracking-wide text-muted">Not found</p>
      <h1 className="text-2xl font-bold">There is nothing at this address</h1>
      <p className="text-muted">The record may have been removed, or it belongs to another organisation.</p>
      <Link href="/" className="font-semibold text-accent underline underline-offset-4">
        Go to your home page
      </Link>
    </main>
  );
}
