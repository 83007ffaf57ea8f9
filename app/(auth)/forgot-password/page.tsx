import type { Metadata } from "next";
import Link from "next/link";
import { ForgotPasswordForm } from "@/components/auth/forgot-password-form";
import { Card, CardBody } from "@/components/ui";

export const metadata: Metadata = { title: "Reset password" };

export default function ForgotPasswordPage() {
  return (
    <Card>
      <CardBody className="flex flex-col gap-5">
        <div>
          <h1 className="text-2xl font-bold">Reset your password</h1>
          <p className="text-muted">We e-mail you a link that works once and for one hour.</p>
        </div>
        <ForgotPasswordForm />
        <Link href="/sign-in" className="self-center text-sm font-medium text-accent underline underline-offset-4">
          Back to sign-in
        </Link>
      </CardBody>
    </Card>
  );
}
