"use client";

import { useState } from "react";
import { deleteLineAction } from "@/app/(app)/standards/actions";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
import { Button, Dialog, DialogContent, DialogDescription, DialogHeader, DialogTitle, DialogTrigger } from "@/components/ui";
import type { EditionLine } from "@/lib/variance";
import { LineForm } from "./line-form";

/** Edit (in a dialog) and delete for one line of a draft edition. */
export function LineActions({ standardId, editionId, line, others }: { standardId: string; editionId: string; line: EditionLine; others: Pick<EditionLine, "id" | "code" | "title">[] }) {
  const [open, setOpen] = useState(false);
  const { state, formAction } = useFormAction(deleteLineAction);
  return (
    <div className="flex flex-col items-end gap-1">
      <div className="flex gap-1">
        <Dialog open={open} onOpenChange={setOpen}>
          <DialogTrigger asChild>
            <Button variant="secondary" size="sm" aria-label={`Edit ${line.code}`}>
              Edit
            </Button>
          </DialogTrigger>
          <DialogContent size="lg">
            <DialogHeader>
              <DialogTitle>
                Edit {line.code} {line.title}
              </DialogTitle>
              <DialogDescription>The line keeps its key ({line.key}), so fitments recorded against it still count.</DialogDescription>
            </DialogHeader>
            <LineForm standardId={standardId} editionId={editionId} line={line} others={others} onDone={() => setOpen(false)} />
          </DialogContent>
        </Dialog>
        <form action={formAction}>
          <input type="hidden" name="standardId" value={standardId} />
          <input type="hidden" name="editionId" value={editionId} />
          <input type="hidden" name="lineId" value={line.id} />
          <SubmitButton variant="ghost" size="sm" aria-label={`Delete ${line.code}`}>
            Delete
          </SubmitButton>
        </form>
      </div>
      {state.status === "error" && (
        <div className="w-72 text-left">
          <FormStatus state={state} testId={`delete-${line.code}-status`} />
        </div>
      )}
    </div>
  );
}
