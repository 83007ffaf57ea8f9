import type { Metadata } from "next";
import Link from "next/link";
import { SetPasswordForm } from "@/components/auth/set-password-form";
import { Card, CardBody, FormMessage } from "@/components/ui";
import { inspectPasswordToken } from "@/lib/commands/passwords";

export const metadata: Metadata = { title: "Choose a password" };

export default async function PasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const info = await inspectPasswordToken(token);
  return (
    <Card>
      <CardBody className="flex flex-col gap-5">
        {info ? (
          <>
            <div>
              <h1 className="text-2xl font-bold">{info.purpose === "invite" ? "Welcome to Rigline" : "Choose a new password"}</h1>
              <p className="text-muted">
                {info.purpose === "invite" ? `Set a password for ${info.email} to finish your account.` : `For ${info.email}.`}
              </p>
            </div>
            <SetPasswordForm token={token} email={info.email} />
          </>
        ) : (
          <>
            <h1 className="text-2xl font-bold">This link no longer works</h1>
            <FormMessage tone="error" label="Link problem">
              The link has expired or has already been used. Links work once: ask for a new one.
            </FormMessage>
            <Link href="/forgot-password" className="font-medium text-accent underline underline-offset-4">
              Ask for a new link
            </Link>
          </>
        )}
      </CardBody>
    </Card>
  );
}
