import Link from "next/link";

export default function Forbidden() {
  return (
    <main className="mx-auto flex max-w-xl flex-col gap-4 px-4 py-16">
      <p className="text-sm font-semibold uppercase tracking-wide text-danger">Not allowed</p>
      <h1 className="text-2xl font-bold">Your role cannot open this page</h1>
      <p className="text-muted">
        Rigline shows each person what their role needs. If you think you should see this, ask your organisation&apos;s
        administrator.
      </p>
      <Link href="/" className="font-semibold text-accent underline underline-offset-4">
        Go to your home page
      </Link>
    </main>
  );
}
