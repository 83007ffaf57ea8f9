"use client";

import { Button } from "@/components/ui";

export default function AppError({ reset }: { error: Error; reset: () => void }) {
  return (
    <div className="flex max-w-xl flex-col gap-4 py-10">
      <h1 className="text-2xl font-bold">This page could not be shown</h1>
      <p className="text-muted">Something went wrong on our side. Nothing you entered was changed. Try again in a moment.</p>
      <div>
        <Button onClick={reset}>Try again</Button>
      </div>
    </div>
  );
}
