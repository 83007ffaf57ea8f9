import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { SignInForm } from "@/components/auth/sign-in-form";
import { Card, CardBody, FormMessage } from "@/components/ui";
import { DEMO_PASSWORD } from "@/db/seed/scenario";
import { env } from "@/lib/env";
import { currentUser } from "@/lib/server/session";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({
  searchParams,
}: {
  searchParams: Promise<{ next?: string; signedOut?: string; passwordSet?: string }>;
}) {
  const params = await searchParams;
  if (await currentUser()) redirect(params.next ?? "/");
  const demo = env().RIGLINE_MODE === "demo";
  return (
    <Card>
      <CardBody className="flex flex-col gap-5">
        <div>
          <h1 className="text-2xl font-bold">Sign in to Rigline</h1>
          <p className="text-muted">Use the e-mail address your organisation invited.</p>
        </div>
        {params.signedOut && <FormMessage tone="success" label="Signed out">You are signed out.</FormMessage>}
        {params.passwordSet && (
          <FormMessage tone="success" label="Password set">Your password is set. Sign in with it now.</FormMessage>
        )}
        <SignInForm next={params.next} />
        {demo && (
          <aside aria-label="Demo sign-in" className="rounded-md border border-line bg-surface-sunken p-3 text-sm">
            <p className="font-semibold">Demo mode</p>
            <p>
              Every demo account uses the password <code className="font-mono font-semibold">{DEMO_PASSWORD}</code>, for
              example <code className="font-mono">manager@mirrabel-health.example</code>. The README lists them all.
            </p>
          </aside>
        )}
      </CardBody>
    </Card>
  );
}
