import type { Metadata } from "next";
import Link from "next/link";
import { ProfileForm } from "@/components/admin/profile-form";
import { Card, CardBody, CardHeader, PageHeader } from "@/components/ui";
import { readProfile } from "@/lib/commands/profile";
import { ROLE_LABELS } from "@/lib/permissions";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";

export const metadata: Metadata = { title: "Profile" };

export default async function ProfilePage() {
  const user = await requirePermission("manage", "Profile");
  const profile = await execute(readProfile, user, {});
  return (
    <div className="flex flex-col gap-6">
      <PageHeader title="Profile" question="How does Rigline know and reach me?" />
      <Card>
        <CardHeader title={profile.email} description={`${ROLE_LABELS[user.role]} at ${user.orgName}`} />
        <CardBody className="flex flex-col gap-4">
          <ProfileForm name={profile.name} notifyNonEssential={profile.notifyNonEssential} />
          <p className="text-sm text-muted">
            To change your password, <Link href="/forgot-password" className="font-semibold text-accent underline">ask for a reset link</Link>: it ends your other sessions too.
          </p>
          <p className="text-sm text-muted">Let another system act for you: <Link href="/profile/tokens" className="font-semibold text-accent underline">API tokens</Link>.</p>
        </CardBody>
      </Card>
    </div>
  );
}
